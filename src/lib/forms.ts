import type { FieldValues, Path, UseFormSetError } from "react-hook-form";
import { ApiError } from "./api-client";

/**
 * Puts the server's per-field messages on the form's fields; returns the message for the form as a
 * whole (errors that belong to no field the form shows).
 */
export function applyServerErrors<T extends FieldValues>(error: unknown, setError: UseFormSetError<T>, fieldNames: readonly Path<T>[]): string | null {
  if (!(error instanceof ApiError)) return "Something went wrong. Try again.";
  let placed = false;
  for (const [field, message] of Object.entries(error.fields)) {
    if ((fieldNames as readonly string[]).includes(field)) {
      setError(field as Path<T>, { type: "server", message });
      placed = true;
    }
  }
  return placed && error.code === "validation_failed" ? null : error.message;
}
