import type { z } from "zod";
import { fieldMessages } from "../../shared/http/errors";
import { versionSchema } from "../../shared/http/version";
import { isUuid } from "../../shared/http/ids";
import { AppError } from "./app-error";

interface Visit {
  value: object;
  key: string | number;
  parent: Visit | null;
}

function pathTo(visit: Visit): string[] {
  const path: string[] = [];
  for (let at: Visit = visit; at.parent; at = at.parent) path.push(String(at.key));
  return path.reverse();
}

/**
 * PostgreSQL can store no NUL character in text or JSON; find one before it turns into a 500.
 * Iterative, one pass over the body; the path is built only for the string found. Within an object
 * its own strings are checked before what is nested in it.
 */
export function pathOfNul(body: unknown): string[] | null {
  if (typeof body === "string") return body.includes("\u0000") ? [] : null;
  if (typeof body !== "object" || body === null) return null;
  const pending: Visit[] = [{ value: body, key: "", parent: null }];
  while (pending.length > 0) {
    const visit = pending.pop()!;
    const list = Array.isArray(visit.value) ? (visit.value as unknown[]) : null;
    const keys = list ? null : Object.keys(visit.value);
    const count = list ? list.length : keys!.length;
    const nested: Visit[] = [];
    for (let i = 0; i < count; i++) {
      const key = list ? i : keys![i]!;
      const inner = list ? list[i] : (visit.value as Record<string, unknown>)[key];
      if (typeof inner === "string") {
        if (inner.includes("\u0000")) return [...pathTo(visit), String(key)];
      } else if (typeof inner === "object" && inner !== null) {
        nested.push({ value: inner, key, parent: visit });
      }
    }
    for (let i = nested.length - 1; i >= 0; i--) pending.push(nested[i]!);
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

/**
 * A save's body: the schema's fields and, beside them, `version`, the version of the record they
 * were made against (shared/http/version.ts). Both are checked, their messages given together.
 */
export function parseVersioned<S extends z.ZodType>(schema: S, body: unknown): { version: number; input: z.infer<S> } {
  const isObject = typeof body === "object" && body !== null && !Array.isArray(body);
  const { version, ...fields } = isObject ? (body as Record<string, unknown>) : {};
  const checked = versionSchema.safeParse(version);
  const versionError: Record<string, string> = checked.success ? {} : { version: checked.error.issues[0]!.message };
  let input: z.infer<S>;
  try {
    input = parseBody(schema, isObject ? fields : body);
  } catch (error) {
    if (error instanceof AppError && error.fields) throw new AppError(error.code, error.message, { ...error.fields, ...versionError });
    throw error;
  }
  if (!checked.success) throw new AppError("validation_failed", "Some fields need attention.", versionError);
  return { version: checked.data, input };
}

/** A malformed id can't name any row, so it answers like a missing one. */
export function parseId(value: unknown, what: string): string {
  if (!isUuid(value)) throw new AppError("not_found", `${what} not found.`);
  return value.toLowerCase();
}
