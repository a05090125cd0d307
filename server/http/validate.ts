import type { z } from "zod";
import { fieldMessages } from "../../shared/http/errors";
import { AppError } from "./app-error";

/** PostgreSQL can store no NUL character in text or JSON; find one before it turns into a 500. */
function pathOfNul(value: unknown, path: string[] = []): string[] | null {
  if (typeof value === "string") return value.includes("\u0000") ? path : null;
  if (typeof value !== "object" || value === null) return null;
  for (const [key, inner] of Object.entries(value)) {
    const found = pathOfNul(inner, [...path, key]);
    if (found) return found;
  }
  return null;
}

export function parseBody<S extends z.ZodType>(schema: S, body: unknown): z.infer<S> {
  const nul = pathOfNul(body);
  if (nul) {
    throw new AppError("validation_failed", "Some fields need attention.", { [nul.join(".") || "_"]: "Remove the NUL character (\\0) from this text." });
  }
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
