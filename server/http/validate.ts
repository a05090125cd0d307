import type { z } from "zod";
import { fieldMessages } from "../../shared/http/errors";
import { AppError } from "./app-error";

export function parseBody<S extends z.ZodType>(schema: S, body: unknown): z.infer<S> {
  const result = schema.safeParse(body ?? {});
  if (!result.success) {
    throw new AppError("validation_failed", "Some fields need attention.", fieldMessages(result.error.issues));
  }
  return result.data;
}

const uuidPattern = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** A malformed id can't name any row, so it answers like a missing one. */
export function parseId(value: unknown, what: string): string {
  if (typeof value !== "string" || !uuidPattern.test(value)) throw new AppError("not_found", `${what} not found.`);
  return value.toLowerCase();
}
