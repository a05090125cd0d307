import { useId, type ReactNode, type Ref, type TextareaHTMLAttributes } from "react";
import type { FieldErrors, FieldValues, Resolver } from "react-hook-form";
import type { z } from "zod";
import { fieldMessages } from "@shared/http/errors";
import { ApiError } from "../../../lib/api-client";

/**
 * Sponsor forms hold what people type (strings; talking points one per line) while the shared schemas
 * speak numbers, lists and nulls. A form turns its values into the API body, the shared zod schema the
 * server uses judges it, and each message lands on the field it belongs to. On success the handler
 * receives the parsed body, exactly what the server will parse again.
 */
export function schemaResolver<F extends FieldValues, S extends z.ZodType>(
  schema: S,
  toBody: (values: F) => unknown,
  fieldFor: (path: string) => string = (path) => path,
): Resolver<F, unknown, z.output<S>> {
  return async (values) => {
    const parsed = schema.safeParse(toBody(values));
    if (parsed.success) return { values: parsed.data, errors: {} };
    const messages: Record<string, string> = {};
    for (const [path, message] of Object.entries(fieldMessages(parsed.error.issues))) messages[fieldFor(path)] ??= message;
    return { values: {}, errors: nest(messages) as FieldErrors<F> };
  };
}

/** {"money.fee": "…"} → the nested error object react-hook-form reads. */
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
      node[key] ??= {};
      node = node[key] as Record<string, unknown>;
    });
  }
  return root;
}

export function errorAt(errors: FieldErrors, path: string): string | undefined {
  let node: unknown = errors;
  for (const key of path.split(".")) node = (node as Record<string, unknown> | undefined)?.[key];
  return node && typeof node === "object" && "message" in node ? String((node as { message: unknown }).message) : undefined;
}

/** A number typed as text: blank and junk become NaN, which the schema answers with its own message. */
export const numberFrom = (text: string) => (text.trim() === "" ? Number.NaN : Number(text.trim().replace(",", ".")));

export const linesOf = (text: string) =>
  text
    .split("\n")
    .map((line) => line.trim())
    .filter((line) => line.length > 0);

export function TextArea({ label, error, hint, ref, className = "", ...area }: TextareaHTMLAttributes<HTMLTextAreaElement> & { label: string; error?: string; hint?: ReactNode; ref?: Ref<HTMLTextAreaElement> }) {
  const id = useId();
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="text-sm font-medium text-graphite-700">
        {label}
      </label>
      <textarea
        id={id}
        ref={ref}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${id}-error` : hint ? `${id}-hint` : undefined}
        className={`rounded-md border bg-white px-3 py-2 text-base shadow-inner ${error ? "border-alarm-600" : "border-ply-300"} ${className}`}
        {...area}
      />
      {hint && !error && (
        <p id={`${id}-hint`} className="text-xs text-graphite-500">
          {hint}
        </p>
      )}
      {error && (
        <p id={`${id}-error`} className="text-sm text-alarm-600">
          {error}
        </p>
      )}
    </div>
  );
}

type Tone = "neutral" | "warn" | "alarm" | "good";
const tones: Record<Tone, string> = {
  neutral: "bg-ply-200 text-graphite-700",
  warn: "bg-amber-cut/30 text-graphite-900",
  alarm: "bg-alarm-600/10 text-alarm-600",
  good: "bg-moss-600/10 text-moss-600",
};

export function Tag({ tone = "neutral", children }: { tone?: Tone; children: ReactNode }) {
  return <span className={`inline-flex items-center rounded px-2 py-0.5 text-xs font-semibold ${tones[tone]}`}>{children}</span>;
}

/** The server's per-field messages, placed on this form's fields through the same path mapping. */
export function placeServerErrors(
  error: unknown,
  setError: (name: never, error: { type: string; message: string }) => void,
  names: readonly string[],
  fieldFor: (path: string) => string = (path) => path,
): string | null {
  if (!(error instanceof ApiError)) return "Something went wrong. Try again.";
  let placed = false;
  for (const [path, message] of Object.entries(error.fields)) {
    const name = fieldFor(path);
    if (names.includes(name)) {
      setError(name as never, { type: "server", message });
      placed = true;
    }
  }
  return placed && error.code === "validation_failed" ? null : error.message;
}
