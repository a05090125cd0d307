import { formatInstantNamingZone } from "../../shared/fields/written-dates";

/**
 * A moment in a queued mail's text. Mail to a member is worded when it is queued but addressed when it
 * is sent, so a moment travels as a marker and is written then, in the recipient's own time zone
 * (`writeMoments`, run by the member mail's renderer): "Sat 12 Dec 2026, 18:00 UTC+1 (Europe/Berlin)".
 */
export const momentFor = (at: Date) => `{{moment:${at.toISOString()}}}`;

const marker = /\{\{moment:(\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}\.\d{3}Z)\}\}/g;

/** The text with every moment written in this zone. */
export const writeMoments = (text: string, timeZone: string) => text.replace(marker, (_, iso: string) => formatInstantNamingZone(iso, timeZone));
