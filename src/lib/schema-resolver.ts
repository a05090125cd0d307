import { toNestErrors } from "@hookform/resolvers";
import type { FieldError, FieldValues, Resolver } from "react-hook-form";
import type { z } from "zod";
import { fieldMessages } from "@shared/http/errors";
import { converter, type Converter } from "./forms";

/**
 * The resolver for forms that hold text: `toBody` builds the request body (reading numbers with the
 * converter it is handed), the shared schema parses it, and the messages go onto the fields through
 * @hookform/resolvers' own `toNestErrors`. `fieldFor` maps a body path to the field showing it
 * ("talkingPoints.2" → "talkingPoints").
 */
export function schemaResolver<F extends FieldValues, S extends z.ZodType>(
  schema: S,
  toBody: (values: F, read: Converter) => unknown,
  fieldFor: (path: string) => string = (path) => path,
): Resolver<F, unknown, z.output<S>> {
  return async (values, _context, options) => {
    const read = converter();
    const parsed = schema.safeParse(toBody(values, read));
    const messages: Record<string, string> = {};
    const judged = { ...(parsed.success ? {} : fieldMessages(parsed.error.issues)), ...read.errors };
    for (const [path, message] of Object.entries(judged)) messages[path === "_" ? "root" : fieldFor(path)] ??= message;
    if (parsed.success && Object.keys(messages).length === 0) return { values: parsed.data, errors: {} };
    const flat: Record<string, FieldError> = Object.fromEntries(Object.entries(messages).map(([path, message]) => [path, { type: "validation", message }]));
    return { values: {}, errors: toNestErrors<F>(flat, options) };
  };
}
