import { z } from "zod";
import type { Area } from "../access/roles";
import { oneLine } from "../fields/text";

/** Every kind of record search finds, in the order its groups are shown. */
export const searchKinds = ["episode", "testPlan", "benchRun", "part", "buildEntry", "shot", "clip", "mark", "comment", "sponsor", "deal", "dealMoney"] as const;
export type SearchKind = (typeof searchKinds)[number];

export const searchKindLabels: Record<SearchKind, string> = {
  episode: "Episodes",
  testPlan: "Test plans",
  benchRun: "Bench runs",
  part: "Shelf parts",
  buildEntry: "Build log",
  shot: "Shot lists",
  clip: "Clips",
  mark: "Marks on clips",
  comment: "Comments",
  sponsor: "Sponsors",
  deal: "Sponsor deals",
  dealMoney: "Deal money",
};

/** The role table's areas a search entry can need (shared/access/roles.ts): the query keeps only those the caller reads. */
export type SearchArea = Extract<Area, "episodes" | "testPlan" | "bench" | "shoot" | "footage" | "comments" | "sponsors" | "fees">;

/** What a link needs beyond the record and its episode (the clip of a mark, the sponsor of a deal). */
export interface SearchPlace {
  clipId?: string;
  sponsorId?: string;
  /** A run's or an iteration's number. */
  number?: number;
  /** Where a mark begins, as its timecode was typed. */
  at?: string;
}

/** A piece of a title or snippet: `match` where it matched a searched word (shown highlighted, as text). */
export interface TextRun {
  text: string;
  match: boolean;
}

export const searchQuerySchema = z.strictObject({
  q: oneLine(200, { blank: "Type a word to search for.", tooLong: "Keep the search under 200 characters." }),
});

export interface SearchHit {
  kind: SearchKind;
  id: string;
  episodeId: string | null;
  episodeTitle: string | null;
  place: SearchPlace;
  title: TextRun[];
  snippet: TextRun[];
  score: number;
}

export interface SearchGroup {
  kind: SearchKind;
  label: string;
  hits: SearchHit[];
}

export interface SearchAnswer {
  query: string;
  groups: SearchGroup[];
}
