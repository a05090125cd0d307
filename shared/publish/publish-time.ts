/**
 * A publish time is a wall-clock time in the package's zone ("2027-03-05 17:00 in Europe/Oslo"); the
 * server keeps the instant. The zone's offset is read from the platform's own time-zone data (Intl, IANA tz).
 */
function offsetMinutes(instant: Date, timeZone: string): number {
  const parts = new Intl.DateTimeFormat("en-US", { timeZone, hourCycle: "h23", year: "numeric", month: "2-digit", day: "2-digit", hour: "2-digit", minute: "2-digit", second: "2-digit" }).formatToParts(instant);
  const get = (type: string) => Number(parts.find((p) => p.type === type)?.value);
  const asUtc = Date.UTC(get("year"), get("month") - 1, get("day"), get("hour"), get("minute"), get("second"));
  return Math.round((asUtc - Math.floor(instant.getTime() / 1000) * 1000) / 60_000);
}

/** The instant of "YYYY-MM-DDTHH:mm" read in `timeZone`; null when the text is not such a time. */
export function instantOfWallTime(wallTime: string, timeZone: string): Date | null {
  const match = /^(\d{4})-(\d{2})-(\d{2})T(\d{2}):(\d{2})$/.exec(wallTime);
  if (!match) return null;
  const [, y, mo, d, h, mi] = match.map(Number) as [number, number, number, number, number, number];
  const guess = Date.UTC(y, mo - 1, d, h, mi);
  // Twice: the first offset may be the other side of a daylight-saving change from the answer.
  const first = guess - offsetMinutes(new Date(guess), timeZone) * 60_000;
  return new Date(guess - offsetMinutes(new Date(first), timeZone) * 60_000);
}

/** "YYYY-MM-DDTHH:mm" of an instant in `timeZone`, for a datetime-local field. */
export function wallTimeOf(instant: Date, timeZone: string): string {
  const shifted = new Date(instant.getTime() + offsetMinutes(instant, timeZone) * 60_000);
  return shifted.toISOString().slice(0, 16);
}
