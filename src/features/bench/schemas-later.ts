/**
 * The bench's shared schemas, fetched (with zod and mathjs) when a form first checks what was typed:
 * the test plan sheet paints without them. Read the words and units it shows from
 * @shared/bench/metrics, @shared/bench/units and @shared/bench/format instead.
 */
export const benchSchemas = () => import("@shared/bench/schemas");
