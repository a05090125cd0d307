import { sql, type Column } from "drizzle-orm";

/** A saved record's next version (schema/columns.ts `version()`): set it in the same update that checks the old one. */
export const nextVersion = (column: Column) => sql<number>`${column} + 1`;
