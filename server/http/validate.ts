import type { z } from "zod";
import { fieldMessages } from "../../shared/http/errors";
import { AppError } from "./app-error";

interface Visit {
  value: unknown;
  key: string;
  parent: Visit | null;
}

function pathTo(visit: Visit): string[] {
  const path: string[] = [];
  for (let at: Visit = visit; at.parent; at = at.parent) path.push(at.key);
  return path.reverse();
}

/**
 * PostgreSQL can store no NUL character in text or JSON; find one before it turns into a 500.
 * Iterative, and the path is built only for the one string found, so any shape costs one pass.
 */
export function pathOfNul(body: unknown): string[] | null {
  const pending: Visit[] = [{ value: body, key: "", parent: null }];
  while (pending.length > 0) {
    const visit = pending.pop()!;
    const { value } = visit;
    if (typeof value === "string") {
      if (value.includes("\u0000")) return pathTo(visit);
    } else if (typeof value === "object" && value !== null) {
      // Pushed last to first, so the first field in the body is the one reported.
      const entries = Object.entries(value);
      for (let i = entries.length - 1; i >= 0; i--) pending.push({ value: entries[i]![1], key: entries[i]![0], parent: visit });
    }
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
