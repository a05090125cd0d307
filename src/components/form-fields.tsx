import { useId, type InputHTMLAttributes, type ReactNode, type Ref, type SelectHTMLAttributes, type TextareaHTMLAttributes } from "react";
import type { UseFormRegisterReturn } from "react-hook-form";
import { Button } from "./Button";

/**
 * Kerf's form fields: each has its label, an optional hint and its error message, tied to the control
 * for screen readers (aria-describedby, aria-invalid). Every form builds from these; the form logic
 * (resolver, server errors, reading numbers) is in src/lib/forms.ts.
 */

interface FrameProps {
  label: string;
  hint?: ReactNode;
  error?: string;
}

/** Most hints give way to the error; a value-and-unit field keeps its hint (it lists the units the error is about). */
type HintRule = { keepHint?: boolean };

// min-w-0: a long option or value never pushes its form wider than a phone.
const controlClass = (error?: string) => `min-w-0 max-w-full rounded-md border bg-white px-3 py-2 text-base shadow-inner disabled:bg-ply-100 ${error ? "border-alarm-600" : "border-ply-300"}`;

/** The ids a field's control points at: its error, and its hint while it shows. */
function useFrame({ hint, error, keepHint = false }: Omit<FrameProps, "label"> & HintRule) {
  const id = useId();
  const describedBy = [error ? `${id}-error` : null, hint && (keepHint || !error) ? `${id}-hint` : null].filter(Boolean).join(" ") || undefined;
  return { id, control: { id, "aria-invalid": error ? true : undefined, "aria-describedby": describedBy } };
}

function Frame({ id, label, hint, error, keepHint = false, children }: FrameProps & HintRule & { id: string; children: ReactNode }) {
  return (
    <div className="flex min-w-0 flex-col gap-1">
      <label htmlFor={id} className="text-sm font-medium text-graphite-700">
        {label}
      </label>
      {children}
      {error && (
        <p id={`${id}-error`} className="text-sm text-alarm-600">
          {error}
        </p>
      )}
      {hint && (keepHint || !error) && (
        <p id={`${id}-hint`} className="text-xs text-graphite-500">
          {hint}
        </p>
      )}
    </div>
  );
}

type InputProps = InputHTMLAttributes<HTMLInputElement> & FrameProps & { ref?: Ref<HTMLInputElement> };

export function TextField({ label, hint, error, ref, className = "", ...input }: InputProps) {
  const { id, control } = useFrame({ hint, error });
  return (
    <Frame id={id} label={label} hint={hint} error={error}>
      <input ref={ref} {...control} className={`${controlClass(error)} ${className}`} {...input} />
    </Frame>
  );
}

/** A number typed as text, so "2,4" and a half-typed value stay what the person wrote until the form reads them. */
export function NumberField({ whole = false, ...props }: InputProps & { whole?: boolean }) {
  return <TextField inputMode={whole ? "numeric" : "decimal"} autoComplete="off" {...props} />;
}

export function SelectField({
  label,
  hint,
  error,
  options,
  ref,
  ...select
}: SelectHTMLAttributes<HTMLSelectElement> & FrameProps & { options: { value: string; label: string }[]; ref?: Ref<HTMLSelectElement> }) {
  const { id, control } = useFrame({ hint, error });
  return (
    <Frame id={id} label={label} hint={hint} error={error}>
      <select ref={ref} {...control} className={`${controlClass(error)} shadow-none`} {...select}>
        {options.map((option) => (
          <option key={option.value} value={option.value}>
            {option.label}
          </option>
        ))}
      </select>
    </Frame>
  );
}

export function TextAreaField({ label, hint, error, ref, className = "", ...textarea }: TextareaHTMLAttributes<HTMLTextAreaElement> & FrameProps & { ref?: Ref<HTMLTextAreaElement> }) {
  const { id, control } = useFrame({ hint, error });
  return (
    <Frame id={id} label={label} hint={hint} error={error}>
      <textarea ref={ref} rows={3} {...control} className={`${controlClass(error)} ${className}`} {...textarea} />
    </Frame>
  );
}

/** One box; several registered under one name, each with its own `value`, make a list of the values ticked. */
export function CheckboxField({ label, hint, ...input }: UseFormRegisterReturn & { label: string; hint?: string; value?: string }) {
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

/** A value and its unit side by side. `freeUnit` lets people type any unit (with suggestions), so a wrong one can be explained. */
export function QuantityField({
  label,
  valueProps,
  unitProps,
  units,
  freeUnit = false,
  error,
  hint,
}: FrameProps & {
  valueProps: UseFormRegisterReturn;
  unitProps: UseFormRegisterReturn;
  units: readonly string[];
  freeUnit?: boolean;
}) {
  const { id, control } = useFrame({ hint, error, keepHint: true });
  const unitLabel = `Unit of ${label.toLocaleLowerCase()}`;
  const unitControl = { "aria-label": unitLabel, "aria-invalid": control["aria-invalid"], "aria-describedby": control["aria-describedby"], className: `${controlClass(error)} w-24 rounded-l-none border-l-0` };
  return (
    <Frame id={id} label={label} hint={hint} error={error} keepHint>
      <div className="flex">
        <input {...control} inputMode="decimal" autoComplete="off" className={`${controlClass(error)} w-full min-w-0 rounded-r-none`} {...valueProps} />
        {freeUnit ? (
          <>
            <input {...unitControl} list={`${id}-units`} autoComplete="off" {...unitProps} />
            <datalist id={`${id}-units`}>
              {units.map((unit) => (
                <option key={unit} value={unit} />
              ))}
            </datalist>
          </>
        ) : (
          <select {...unitControl} {...unitProps}>
            {units.map((unit) => (
              <option key={unit} value={unit}>
                {unit}
              </option>
            ))}
          </select>
        )}
      </div>
    </Frame>
  );
}

/** A form's buttons: the one that sends it and, where the form can be closed, Cancel. */
export function FormActions({ submit, busy, onCancel, className = "flex flex-wrap gap-2" }: { submit: ReactNode; busy: boolean; onCancel?: () => void; className?: string }) {
  return (
    <div className={className}>
      <Button type="submit" busy={busy}>
        {submit}
      </Button>
      {onCancel && (
        <Button type="button" tone="quiet" onClick={onCancel}>
          Cancel
        </Button>
      )}
    </div>
  );
}
