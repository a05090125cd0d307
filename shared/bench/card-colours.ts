import { z } from "zod";

/**
 * Colour arithmetic for the results card, from WCAG 2.1's definitions ("relative luminance" and
 * "contrast ratio", Understanding SC 1.4.3): the card is read on a screen at a glance, so its words
 * keep at least 4.5 : 1 against the background and its marks at least 3 : 1 (SC 1.4.11).
 */
export const hexColourSchema = z.string().regex(/^#[0-9a-f]{6}$/i, "Give a colour as # and six hex digits, like #1f2a2c.");

export const cardColoursSchema = z.strictObject({
  background: hexColourSchema,
  ink: hexColourSchema,
  accent: hexColourSchema,
});
export type CardColours = z.infer<typeof cardColoursSchema>;
/** A change of the channel's card colours; null goes back to Kerf's own. */
export const cardColoursInputSchema = z.strictObject({ colours: cardColoursSchema.nullable() });

/** Kerf's own: plywood paper, graphite ink, the cut-line amber marking the best candidate. */
export const defaultCardColours: CardColours = { background: "#fbf9f5", ink: "#1f2a2c", accent: "#f2b33d" };

export const TEXT_CONTRAST = 4.5;
export const MARK_CONTRAST = 3;

function channel(value: number): number {
  const c = value / 255;
  return c <= 0.03928 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
}

export function relativeLuminance(hex: string): number {
  const n = Number.parseInt(hex.slice(1), 16);
  return 0.2126 * channel((n >> 16) & 255) + 0.7152 * channel((n >> 8) & 255) + 0.0722 * channel(n & 255);
}

export function contrastRatio(a: string, b: string): number {
  const [light, dark] = [relativeLuminance(a), relativeLuminance(b)].sort((x, y) => y - x) as [number, number];
  return (light + 0.05) / (dark + 0.05);
}

/** What is wrong with a set of card colours, in words; empty when they read well. */
export function colourProblems(colours: CardColours): string[] {
  const problems: string[] = [];
  const ink = contrastRatio(colours.ink, colours.background);
  if (ink < TEXT_CONTRAST) problems.push(`The text colour has ${ink.toFixed(1)} : 1 contrast with the background; it needs at least ${TEXT_CONTRAST} : 1.`);
  return problems;
}

/**
 * Verdict colours that stay readable on the channel's background: the darker pair on a light
 * background, the lighter pair on a dark one, whichever contrasts more.
 */
const verdictPairs = {
  pass: ["#3d6b4f", "#8fd3a6"],
  fail: ["#b3261e", "#ff8a80"],
  incomplete: ["#5b6567", "#c4cccd"],
} as const;

export function verdictColoursOn(background: string): Record<keyof typeof verdictPairs, string> {
  const pick = ([dark, light]: readonly [string, string]) => (contrastRatio(dark, background) >= contrastRatio(light, background) ? dark : light);
  return { pass: pick(verdictPairs.pass), fail: pick(verdictPairs.fail), incomplete: pick(verdictPairs.incomplete) };
}

/** Text on the accent band: the ink or the background, whichever reads better on it. */
export function textOn(fill: string, colours: CardColours): string {
  return contrastRatio(colours.ink, fill) >= contrastRatio(colours.background, fill) ? colours.ink : colours.background;
}
