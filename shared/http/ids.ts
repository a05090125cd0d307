const uuidPattern = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** Whether a value can name a row: any 8-4-4-4-12 hexadecimal id, of whatever version. */
export const isUuid = (value: unknown): value is string => typeof value === "string" && uuidPattern.test(value);
