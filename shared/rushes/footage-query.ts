import { z } from "zod";
import { oneLine } from "../fields/text";
import { isIsoDate } from "../slate/dates";
import { clipRatings, shotKinds } from "./vocabulary";

/**
 * The editor's footage list: its filters, its sort and its page, as they travel in the page's URL
 * and in the API's query string (the same names in both).
 */
export const footageSorts = ["recorded", "name", "duration", "size", "uploaded"] as const;
export type FootageSort = (typeof footageSorts)[number];
export const footageSortLabels: Record<FootageSort, string> = {
  recorded: "Recorded",
  name: "File name",
  duration: "Duration",
  size: "Size",
  uploaded: "Uploaded",
};

const optionalId = z.uuid({ message: "That filter names nothing." }).optional();
const blankToUndefined = (v: unknown) => (typeof v === "string" && v.trim() === "" ? undefined : v);

export const footageQuerySchema = z.object({
  episodeId: z.preprocess(blankToUndefined, optionalId),
  shootDayId: z.preprocess(blankToUndefined, optionalId),
  shotId: z.preprocess(blankToUndefined, optionalId),
  tag: z.preprocess(blankToUndefined, oneLine(40).toLowerCase().optional()),
  rating: z.preprocess(blankToUndefined, z.enum([...clipRatings, "unrated"]).optional()),
  kind: z.preprocess(blankToUndefined, z.enum(shotKinds).optional()),
  hasMarks: z.preprocess(blankToUndefined, z.enum(["yes", "no"]).optional()),
  camera: z.preprocess(blankToUndefined, oneLine(120).optional()),
  q: z.preprocess(blankToUndefined, oneLine(200).optional()),
  sort: z.preprocess(blankToUndefined, z.enum(footageSorts).default("recorded")),
  dir: z.preprocess(blankToUndefined, z.enum(["asc", "desc"]).default("desc")),
  cursor: z.preprocess(blankToUndefined, z.string().max(500).optional()),
  limit: z.preprocess(blankToUndefined, z.coerce.number().int().min(1).max(200).default(50)),
});
export type FootageQuery = z.infer<typeof footageQuerySchema>;
export type FootageQueryInput = z.input<typeof footageQuerySchema>;

export const filterKeys = ["episodeId", "shootDayId", "shotId", "tag", "rating", "kind", "hasMarks", "camera", "q"] as const;

/** The query as URL search parameters, leaving out what is unset or the default. */
export function footageSearchParams(query: Partial<Record<keyof FootageQuery, string | number | undefined>>): URLSearchParams {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(query)) {
    if (value === undefined || value === "") continue;
    if (key === "sort" && value === "recorded") continue;
    if (key === "dir" && value === "desc") continue;
    if (key === "limit" && Number(value) === 50) continue;
    params.set(key, String(value));
  }
  return params;
}

/** A keyset cursor: the last row's sort value and id, so the next page starts right after it. */
export type Cursor = { v: string | number; id: string };

function toBase64Url(text: string): string {
  const bytes = new TextEncoder().encode(text);
  let binary = "";
  for (const b of bytes) binary += String.fromCharCode(b);
  return btoa(binary).replaceAll("+", "-").replaceAll("/", "_").replace(/=+$/, "");
}

function fromBase64Url(text: string): string {
  const binary = atob(text.replaceAll("-", "+").replaceAll("_", "/"));
  return new TextDecoder().decode(Uint8Array.from(binary, (c) => c.charCodeAt(0)));
}

export function encodeCursor(cursor: Cursor): string {
  return toBase64Url(JSON.stringify([cursor.v, cursor.id]));
}

const cursorSchema = z.tuple([z.union([z.string().max(300), z.number()]), z.uuid()]);

/** Postgres's text form of a timestamptz, e.g. "2026-12-03 23:41:43.123+00". */
const timestampPattern = /^(\d{4}-\d{2}-\d{2}) ([01]\d|2[0-3]):[0-5]\d:[0-5]\d(\.\d{1,6})?[+-]\d{2}(:\d{2}){0,2}$/;
const INT4_MAX = 2_147_483_647;

/**
 * Can the database read this value back as the sort column's type? A cursor is the client's to send,
 * so one that decodes but carries, say, "ten" for a duration is refused here instead of failing the
 * query's cast.
 */
const sortValueFits: Record<FootageSort, (v: string | number) => boolean> = {
  recorded: (v) => isTimestampText(v),
  uploaded: (v) => isTimestampText(v),
  name: (v) => typeof v === "string" && !v.includes("\u0000"),
  duration: (v) => /^-?\d{1,10}$/.test(String(v)) && Math.abs(Number(v)) <= INT4_MAX,
  size: (v) => /^-?\d{1,18}$/.test(String(v)),
};

function isTimestampText(v: string | number): boolean {
  const match = typeof v === "string" ? timestampPattern.exec(v) : null;
  return match !== null && isIsoDate(match[1]!) && match[1]! >= "1000";
}

/** null for a cursor that isn't one of ours for this sort (tampered or stale): the caller answers 400. */
export function decodeCursor(text: string, sort: FootageSort): Cursor | null {
  try {
    const parsed = cursorSchema.safeParse(JSON.parse(fromBase64Url(text)));
    if (!parsed.success || !sortValueFits[sort](parsed.data[0])) return null;
    return { v: parsed.data[0], id: parsed.data[1] };
  } catch {
    return null;
  }
}
