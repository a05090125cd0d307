import type { FieldValues, Resolver } from "react-hook-form";
import type { z } from "zod";
import { resolverOnFirstCheck, type Converter } from "./forms";

/**
 * `schemaResolver` (./schema-resolver.ts) for a shared schema, both fetched the first time the form
 * is checked: a page whose read view holds a form (the test plan sheet) paints without zod.
 */
export function lazySchemaResolver<F extends FieldValues, S extends z.ZodType>(
  load: () => Promise<S>,
  toBody: (values: F, read: Converter) => unknown,
  fieldFor?: (path: string) => string,
): Resolver<F, unknown, z.output<S>> {
  return resolverOnFirstCheck(() => Promise.all([load(), import("./schema-resolver")]).then(([schema, { schemaResolver }]) => schemaResolver(schema, toBody, fieldFor)));
}
