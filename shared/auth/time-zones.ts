import { z } from "zod";

/** "UTC" and the zones this JavaScript engine knows (the IANA time zone database, as ICU ships it). */
export function knownTimeZones(): string[] {
  return ["UTC", ...Intl.supportedValuesOf("timeZone").filter((zone) => zone !== "UTC")];
}

/**
 * The zone's own name as the engine spells it, or null when the engine knows no such zone. Engines
 * accept some names their list leaves out (older or newer spellings, such as Asia/Calcutta and
 * Asia/Kolkata), so the check asks the engine rather than the list.
 */
export function canonicalTimeZone(zone: string): string | null {
  if (!/^[A-Za-z][A-Za-z0-9_+\-/]{0,63}$/.test(zone)) return null;
  try {
    return new Intl.DateTimeFormat("en", { timeZone: zone }).resolvedOptions().timeZone;
  } catch {
    return null;
  }
}

export const timeZoneSchema = z
  .string({ error: "Choose a time zone." })
  .transform((zone, context) => {
    const known = canonicalTimeZone(zone);
    if (known) return known;
    context.addIssue({ code: "custom", message: "Choose a time zone from the list." });
    return z.NEVER;
  });
