import { formatChapters, type Chapter } from "./chapters";

/** What the episode already holds that its description is built from. */
export interface PaidMention {
  company: string;
  disclosure: string | null;
  link: string | null;
  code: string | null;
}

export interface PartUsed {
  name: string;
  boughtFrom: string | null;
}

export interface Credit {
  role: string;
  names: string[];
}

export interface DescriptionParts {
  summary: string;
  mentions: PaidMention[];
  chapters: Chapter[];
  parts: PartUsed[];
  credits: Credit[];
}

/**
 * The lines shown before a viewer opens the description. The platform shows the first few lines under
 * the video; Kerf puts each paid deal's disclosure in the first lines (FTC, "Disclosures 101 for Social
 * Media Influencers": a disclosure must be seen without clicking "more"). Three lines is common practice.
 */
export const FOLD_LINES = 3;

const disclosureLine = (m: PaidMention) => m.disclosure?.trim() || `Sponsored by ${m.company}.`;

function section(heading: string, lines: string[]): string[] {
  return lines.length === 0 ? [] : ["", heading, ...lines];
}

/** The description as Kerf drafts it; the person edits the text afterwards. */
export function buildDescription(parts: DescriptionParts): string {
  const disclosures = parts.mentions.map(disclosureLine);
  const sponsorLines = parts.mentions.flatMap((m) => [
    ...(m.link ? [`${m.company}: ${m.link}`] : []),
    ...(m.code ? [`Code ${m.code} at ${m.company}`] : []),
  ]);
  const lines = [
    ...disclosures,
    ...(parts.summary.trim() ? [...(disclosures.length ? [""] : []), parts.summary.trim()] : []),
    ...section("Sponsor", sponsorLines),
    ...section("Chapters", parts.chapters.length ? [formatChapters(parts.chapters)] : []),
    ...section("Parts used", parts.parts.map((p) => (p.boughtFrom ? `${p.name}: ${p.boughtFrom}` : p.name))),
    ...section("Credits", parts.credits.filter((c) => c.names.length).map((c) => `${c.role}: ${c.names.join(", ")}`)),
  ];
  return lines.join("\n").trim();
}

/** The first lines a viewer sees without opening the description. */
export const beforeFold = (description: string) => description.split("\n").slice(0, FOLD_LINES).join("\n");
