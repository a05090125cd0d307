/**
 * The slate's shared schemas, fetched (with zod) when a form first checks what was typed: the slate
 * and the episode page paint without them. Read the choices and labels they show from
 * @shared/slate/choices instead.
 */
export const slateSchemas = () => import("@shared/slate/schemas");
