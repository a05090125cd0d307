import { useId, type ReactNode, type TextareaHTMLAttributes, type Ref } from "react";
import type { FieldErrors, FieldValues, Resolver, UseFormRegisterReturn } from "react-hook-form";
import type { z } from "zod";
import { fieldMessages } from "@shared/http/errors";

/**
 * Bench forms hold what people type (strings), while the shared schemas speak numbers and units.
 * A form converts its values to the API body, then the same shared zod schema the server uses
 * judges it; the messages land on the fields by path ("threshold.unit", "measurements.thrust").
 */
export interface Converted {
  input: unknown;
  errors: Record<string, string>;
}

export function sharedSchemaResolver<F extends FieldValues>(schema: z.ZodType, toInput: (values: F) => Converted): Resolver<F> {
  return async (values) => {
    const { input, errors } = toInput(values);
    const parsed = schema.safeParse(input);
    const messages = { ...(parsed.success ? {} : fieldMessages(parsed.error.issues)), ...errors };
    if (Object.keys(messages).length === 0) return { values, errors: {} };
    return { values: {}, errors: nest(messages) as FieldErrors<F> };
  };
}

/** Turns {"threshold.unit": "…"} into the nested error object react-hook-form reads. */
export function nest(messages: Record<string, string>): Record<string, unknown> {
  const root: Record<string, unknown> = {};
  for (const [path, message] of Object.entries(messages)) {
    const keys = path === "_" ? ["root"] : path.split(".");
    let node = root;
    keys.forEach((key, index) => {
      if (index === keys.length - 1) {
        node[key] ??= { type: "validation", message };
        return;
      }
      const next = node[key];
      if (next && typeof next === "object" && "message" in next) return; // a whole-field message wins
      node[key] ??= {};
      node = node[key] as Record<string, unknown>;
    });
  }
  return root;
}

/** The message for a field, or for its value or unit when the field is a quantity. */
export function errorAt(errors: FieldErrors, path: string): string | undefined {
  let node: unknown = errors;
  for (const key of path.split(".")) node = (node as Record<string, unknown> | undefined)?.[key];
  const messageOf = (n: unknown) => (n && typeof n === "object" && "message" in n ? String((n as { message: unknown }).message) : undefined);
  const record = node as Record<string, unknown> | undefined;
  return messageOf(node) ?? messageOf(record?.value) ?? messageOf(record?.unit);
}

/** Reads numbers and quantities out of form strings, collecting a message per bad field. */
export function converter() {
  const errors: Record<string, string> = {};
  const number = (raw: string, path: string, required = false): number | undefined => {
    const text = raw.trim();
    if (text === "") {
      if (required) errors[path] = "Enter a number.";
      return undefined;
    }
    // A decimal comma is accepted too: 2,4 oz reads as 2.4 oz.
    const value = Number(/^[-+]?\d+,\d+$/.test(text) ? text.replace(",", ".") : text);
    if (!Number.isFinite(value)) errors[path] = `“${text}” is not a number.`;
    return value;
  };
  /** Blank value: null (optional) or a message (required). */
  const quantity = (raw: QuantityText, path: string, required = false) => {
    if (raw.value.trim() === "" && !required) return null;
    const value = number(raw.value, `${path}.value`, true);
    return { value: value ?? Number.NaN, unit: raw.unit.trim() };
  };
  return { errors, number, quantity };
}

export interface QuantityText {
  value: string;
  unit: string;
}

export const quantityText = (q: { value: number; unit: string } | null | undefined, unit: string): QuantityText =>
  q ? { value: String(q.value), unit: q.unit } : { value: "", unit };

const inputClass = (error?: string) => `rounded-md border bg-white px-3 py-2 text-base shadow-inner ${error ? "border-alarm-600" : "border-ply-300"}`;

/** A value and its unit side by side. `freeUnit` lets people type any unit (with suggestions), so a wrong one can be explained. */
export function QuantityField({
  label,
  valueProps,
  unitProps,
  units,
  freeUnit = false,
  error,
  hint,
}: {
  label: string;
  valueProps: UseFormRegisterReturn;
  unitProps: UseFormRegisterReturn;
  units: readonly string[];
  freeUnit?: boolean;
  error?: string;
  hint?: ReactNode;
}) {
  const id = useId();
  const describedBy = [error ? `${id}-error` : null, hint ? `${id}-hint` : null].filter(Boolean).join(" ") || undefined;
  const unitLabel = `Unit of ${label.toLocaleLowerCase()}`;
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="text-sm font-medium text-graphite-700">
        {label}
      </label>
      <div className="flex">
        <input id={id} inputMode="decimal" autoComplete="off" aria-invalid={error ? true : undefined} aria-describedby={describedBy} className={`${inputClass(error)} w-full min-w-0 rounded-r-none`} {...valueProps} />
        {freeUnit ? (
          <>
            <input aria-label={unitLabel} list={`${id}-units`} autoComplete="off" aria-invalid={error ? true : undefined} aria-describedby={describedBy} className={`${inputClass(error)} w-24 rounded-l-none border-l-0`} {...unitProps} />
            <datalist id={`${id}-units`}>
              {units.map((unit) => (
                <option key={unit} value={unit} />
              ))}
            </datalist>
          </>
        ) : (
          <select aria-label={unitLabel} className={`${inputClass(error)} w-24 rounded-l-none border-l-0`} {...unitProps}>
            {units.map((unit) => (
              <option key={unit} value={unit}>
                {unit}
              </option>
            ))}
          </select>
        )}
      </div>
      {error && (
        <p id={`${id}-error`} className="text-sm text-alarm-600">
          {error}
        </p>
      )}
      {hint && (
        <p id={`${id}-hint`} className="text-xs text-graphite-500">
          {hint}
        </p>
      )}
    </div>
  );
}

export function TextAreaField({ label, error, ref, ...textarea }: TextareaHTMLAttributes<HTMLTextAreaElement> & { label: string; error?: string; ref?: Ref<HTMLTextAreaElement> }) {
  const id = useId();
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="text-sm font-medium text-graphite-700">
        {label}
      </label>
      <textarea
        id={id}
        ref={ref}
        rows={3}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${id}-error` : undefined}
        className={inputClass(error)}
        {...textarea}
      />
      {error && (
        <p id={`${id}-error`} className="text-sm text-alarm-600">
          {error}
        </p>
      )}
    </div>
  );
}

export function CheckboxField({ label, hint, ...input }: UseFormRegisterReturn & { label: string; hint?: string }) {
  const id = useId();
  return (
    <div className="flex items-start gap-2">
      <input id={id} type="checkbox" className="mt-1 size-4 accent-rust-600" {...input} />
      <label htmlFor={id} className="text-sm text-graphite-700">
        <span className="font-medium">{label}</span>
        {hint && <span className="block text-xs text-graphite-500">{hint}</span>}
      </label>
    </div>
  );
}
