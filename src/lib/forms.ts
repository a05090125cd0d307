import type { FieldErrors, FieldValues, Path, Resolver, UseFormSetError } from "react-hook-form";
import type { z } from "zod";
import { ApiError } from "./api-client";

/**
 * How every form judges what was typed and places what the server said. A form whose values are the
 * request body uses react-hook-form's `zodResolver(sharedSchema)`; one that holds text the body speaks
 * numbers, units or lists for uses `schemaResolver` (./schema-resolver.ts). Nothing here loads zod, so
 * the signed-out pages can use it without downloading it up front (see `lazyZodResolver`).
 */

/** Reads numbers and quantities out of form text, keeping a message for each field it can't read. */
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
  /** A blank value is null when optional, a message when required. */
  const quantity = (raw: QuantityText, path: string, required = false) => {
    if (raw.value.trim() === "" && !required) return null;
    const value = number(raw.value, `${path}.value`, true);
    return { value: value ?? Number.NaN, unit: raw.unit.trim() };
  };
  return { errors, number, quantity };
}

export type Converter = ReturnType<typeof converter>;

export interface QuantityText {
  value: string;
  unit: string;
}

export const quantityText = (q: { value: number; unit: string } | null | undefined, unit: string): QuantityText =>
  q ? { value: String(q.value), unit: q.unit } : { value: "", unit };

/** A number the schema judges itself: blank and junk become NaN, which it answers with its own message. */
export const numberFrom = (text: string) => (text.trim() === "" ? Number.NaN : Number(text.trim().replace(",", ".")));

/** A text area's lines, trimmed, without the blank ones. */
export const linesOf = (text: string) =>
  text
    .split("\n")
    .map((line) => line.trim())
    .filter((line) => line.length > 0);

/** The message for a field, or for its value or unit when the field is a quantity. */
export function errorAt(errors: FieldErrors, path: string): string | undefined {
  let node: unknown = errors;
  for (const key of path.split(".")) node = (node as Record<string, unknown> | undefined)?.[key];
  const messageOf = (n: unknown) => (n && typeof n === "object" && "message" in n && (n as { message: unknown }).message ? String((n as { message: unknown }).message) : undefined);
  const record = node as Record<string, unknown> | undefined;
  return messageOf(node) ?? messageOf(record?.value) ?? messageOf(record?.unit);
}

/**
 * Puts the server's per-field messages on the form's fields (through the same `fieldFor` mapping as the
 * resolver); returns the message for the form as a whole, or null when every message found its field.
 */
export function applyServerErrors<T extends FieldValues>(
  error: unknown,
  setError: UseFormSetError<T>,
  fieldNames: readonly (Path<T> | string)[],
  fieldFor: (path: string) => string = (path) => path,
): string | null {
  if (!(error instanceof ApiError)) return "Something went wrong. Try again.";
  let placed = false;
  for (const [path, message] of Object.entries(error.fields)) {
    const field = fieldFor(path);
    if (fieldNames.includes(field)) {
      setError(field as Path<T>, { type: "server", message });
      placed = true;
    }
  }
  return placed && error.code === "validation_failed" ? null : error.message;
}

/** A resolver made the first time the form is checked, from code fetched then, and kept for later checks. */
export function resolverOnFirstCheck<F extends FieldValues, C, T>(make: () => Promise<Resolver<F, C, T>>): Resolver<F, C, T> {
  let resolver: Promise<Resolver<F, C, T>> | null = null;
  return async (values, context, options) => {
    resolver ??= make();
    return (await resolver)(values, context, options);
  };
}

/**
 * `zodResolver` for a shared schema, both fetched the first time the form is checked: the sign-in and
 * sign-up pages keep zod (about 17 kB gzipped) out of their first download.
 */
export function lazyZodResolver<F extends FieldValues>(load: () => Promise<z.ZodType<F, F>>): Resolver<F> {
  return resolverOnFirstCheck(() => Promise.all([load(), import("@hookform/resolvers/zod")]).then(([schema, { zodResolver }]) => zodResolver(schema) as Resolver<F>));
}
