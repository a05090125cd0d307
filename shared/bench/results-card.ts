import { type CardColours, textOn, verdictColoursOn } from "./card-colours";
import { bestRun, type Comparable, type ComparisonKey, comparisonColumns, figureIn, plannedUnit } from "./comparison";
import type { Criterion, PlanVerdict } from "./criteria";
import { describeCriterion, formatNumber, metricLabels, verdictLabels } from "./format";
import { RATIO_UNIT } from "./quantity";

/**
 * The results card: the bench's comparison as a full-HD picture for the edit. Its figures are the
 * comparison table's (same columns, same units: the plan's, else the bench's usual one; same
 * rounding), so the video shows what the bench computed. Drawn here as SVG text by a pure function,
 * and turned into PNG on the server.
 */
export const CARD_WIDTH = 1920;
export const CARD_HEIGHT = 1080;
/** Rows that fit at a size read across a room; the best run always among them. */
export const CARD_ROWS = 5;
const FIGURE_COLUMNS = 3;
/** Figures shown when the plan names fewer: what decides a lift test first. */
const usualFigures: ComparisonKey[] = ["thrust_per_watt", "thrust_to_weight", "thrust", "electrical_power", "mass"];

export interface CardInput {
  title: string;
  channelName: string;
  runs: readonly Comparable[];
  criteria: readonly Criterion[];
}

export interface CardColumn {
  key: ComparisonKey;
  heading: string;
  unit: string;
}

export interface CardRow {
  number: number;
  label: string;
  verdict: PlanVerdict;
  best: boolean;
  /** As the table writes them: formatNumber in the column's unit, "–" when missing. */
  figures: string[];
}

export interface CardTable {
  columns: CardColumn[];
  rows: CardRow[];
  /** Runs on the bench not on the card. */
  more: number;
  plan: string[];
}

const measured = (runs: readonly Comparable[], key: ComparisonKey, unit: string) => runs.some((run) => figureIn(run.evaluation.values[key], unit) !== null);

/** The figures to show: the plan's first, then the usual ones, only those some run has. */
export function cardColumns(runs: readonly Comparable[], criteria: readonly Criterion[]): CardColumn[] {
  const keys = comparisonColumns.map((column) => column.key as ComparisonKey);
  const wanted = [...criteria.filter((c) => c.required).map((c) => c.metric), ...usualFigures, ...criteria.map((c) => c.metric)];
  const chosen: ComparisonKey[] = [];
  for (const key of wanted) {
    if (chosen.length === FIGURE_COLUMNS) break;
    if (!keys.includes(key as ComparisonKey) || chosen.includes(key as ComparisonKey)) continue;
    const unit = plannedUnit(criteria, key as ComparisonKey);
    if (measured(runs, key as ComparisonKey, unit)) chosen.push(key as ComparisonKey);
  }
  return chosen.map((key) => ({ key, heading: metricLabels[key], unit: plannedUnit(criteria, key) }));
}

export function cardTable(input: Pick<CardInput, "runs" | "criteria">): CardTable {
  const columns = cardColumns(input.runs, input.criteria);
  const best = bestRun(input.runs);
  const byNumber = [...input.runs].sort((a, b) => a.number - b.number);
  const shown = byNumber.filter((run) => run.id !== best?.id).slice(0, best ? CARD_ROWS - 1 : CARD_ROWS);
  if (best) shown.push(best);
  shown.sort((a, b) => a.number - b.number);
  return {
    columns,
    rows: shown.map((run) => ({
      number: run.number,
      label: run.label,
      verdict: run.evaluation.verdict,
      best: run.id === best?.id,
      figures: columns.map((column) => {
        const value = figureIn(run.evaluation.values[column.key], column.unit);
        return value === null ? "–" : formatNumber(value);
      }),
    })),
    more: input.runs.length - shown.length,
    plan: input.criteria.filter((c) => c.required).map(describeCriterion),
  };
}

/** Text for an SVG text node: markup characters escaped, control characters dropped. */
export function svgText(text: string): string {
  return text
    .replace(/\p{Cc}/gu, "")
    .replace(/&/g, "&amp;")
    .replace(/</g, "&lt;")
    .replace(/>/g, "&gt;")
    .replace(/"/g, "&quot;");
}

/** Long names are cut by characters: no fonts to measure with here, and the type is wide enough for this. */
export function clip(text: string, max: number): string {
  const chars = [...text];
  return chars.length <= max ? text : `${chars.slice(0, max - 1).join("").trimEnd()}…`;
}

/** Words over at most `lines` lines of `width` characters; what doesn't fit ends the last line with "…". */
export function wrap(text: string, width: number, lines: number): string[] {
  const out: string[] = [];
  let line = "";
  // A hyphenated word may break after its hyphens ("Thrust-to-" / "weight").
  const words = text.split(/\s+/).flatMap((word) => word.split(/(?<=-)(?=.)/)).filter(Boolean);
  const join = (a: string, b: string) => (!a ? b : a.endsWith("-") ? `${a}${b}` : `${a} ${b}`);
  for (const [i, word] of words.entries()) {
    const next = join(line, word);
    if ([...next].length <= width || !line) {
      line = next;
      continue;
    }
    if (out.length === lines - 1) return [...out, clip(words.slice(i).reduce(join, line), width)];
    out.push(line);
    line = word;
  }
  return [...out, clip(line, width)].filter(Boolean);
}

const FONT = "'Work Sans', 'DejaVu Sans', 'Liberation Sans', Arial, sans-serif";
const MARGIN = 96;
const RUN_WIDTH = 640;
const VERDICT_WIDTH = 400;
const TABLE_TOP = 250;
const HEAD_HEIGHT = 130;
const ROW_HEIGHT = 120;

function verdictMark(verdict: PlanVerdict, x: number, y: number, colour: string, background: string): string {
  if (verdict === "pass") return `<circle cx="${x}" cy="${y}" r="15" fill="${colour}"/>`;
  if (verdict === "fail") return `<path d="M${x - 13} ${y - 13}L${x + 13} ${y + 13}M${x + 13} ${y - 13}L${x - 13} ${y + 13}" stroke="${colour}" stroke-width="7" stroke-linecap="round"/>`;
  return `<circle cx="${x}" cy="${y}" r="13" fill="${background}" stroke="${colour}" stroke-width="6"/>`;
}

/**
 * The card as a standalone SVG of 1920 × 1080. `fontFaces` is CSS (@font-face rules) embedded so the
 * file draws the same anywhere; without it the card falls back to the machine's sans-serif.
 */
export function resultsCardSvg(input: CardInput, colours: CardColours, fontFaces = ""): string {
  const table = cardTable(input);
  const verdictColours = verdictColoursOn(colours.background);
  const figureWidth = (CARD_WIDTH - 2 * MARGIN - RUN_WIDTH - VERDICT_WIDTH) / FIGURE_COLUMNS;
  const figureRight = (i: number) => MARGIN + RUN_WIDTH + VERDICT_WIDTH + (i + 1) * figureWidth - 12;
  const parts: string[] = [];
  const text = (x: number, y: number, size: number, content: string, extra = "") =>
    parts.push(`<text x="${x}" y="${y}" font-size="${size}" fill="${colours.ink}"${extra}>${svgText(content)}</text>`);

  parts.push(`<rect width="${CARD_WIDTH}" height="${CARD_HEIGHT}" fill="${colours.background}"/>`);
  parts.push(`<rect x="0" y="0" width="${CARD_WIDTH}" height="18" fill="${colours.accent}"/>`);
  text(MARGIN, 140, 68, clip(input.title, 44), ` font-weight="700"`);
  if (table.plan.length > 0) text(MARGIN, 214, 36, clip(`Plan: ${table.plan.join(" · ")}`, 90));

  const headY = TABLE_TOP + HEAD_HEIGHT;
  text(MARGIN, headY - 24, 30, "Candidate", ` font-weight="700"`);
  text(MARGIN + RUN_WIDTH, headY - 24, 30, "Verdict", ` font-weight="700"`);
  table.columns.forEach((column, i) => {
    const lines = wrap(column.heading, 11, 2);
    lines.forEach((line, n) => text(figureRight(i), headY - 56 - (lines.length - 1 - n) * 34, 30, line, ` font-weight="700" text-anchor="end"`));
    text(figureRight(i), headY - 18, 26, column.unit === RATIO_UNIT ? "ratio" : column.unit, ` text-anchor="end"`);
  });
  parts.push(`<rect x="${MARGIN}" y="${headY}" width="${CARD_WIDTH - 2 * MARGIN}" height="4" fill="${colours.ink}"/>`);

  table.rows.forEach((row, r) => {
    const top = headY + 4 + r * ROW_HEIGHT;
    const base = top + ROW_HEIGHT / 2 + 15;
    if (row.best) {
      parts.push(`<rect x="${MARGIN - 24}" y="${top + 6}" width="${CARD_WIDTH - 2 * MARGIN + 48}" height="${ROW_HEIGHT - 12}" rx="14" fill="none" stroke="${colours.accent}" stroke-width="8"/>`);
      const tagFill = colours.accent;
      parts.push(`<rect x="${MARGIN - 24}" y="${top - 14}" width="120" height="40" rx="8" fill="${tagFill}"/>`);
      parts.push(`<text x="${MARGIN + 36}" y="${top + 15}" font-size="26" font-weight="700" text-anchor="middle" fill="${textOn(tagFill, colours)}">BEST</text>`);
    }
    const weight = row.best ? ` font-weight="700"` : "";
    const label = wrap(row.label, 28, 2);
    text(MARGIN, base, 42, String(row.number), weight);
    label.forEach((line, n) => text(MARGIN + 64, base - (label.length - 1) * 21 + n * 42, label.length > 1 ? 34 : 36, line, weight));
    parts.push(verdictMark(row.verdict, MARGIN + RUN_WIDTH + 16, base - 14, verdictColours[row.verdict], colours.background));
    parts.push(`<text x="${MARGIN + RUN_WIDTH + 48}" y="${base}" font-size="36" font-weight="600" fill="${verdictColours[row.verdict]}">${svgText(verdictLabels[row.verdict])}</text>`);
    row.figures.forEach((figure, i) => text(figureRight(i), base, 48, figure, ` font-weight="${row.best ? 700 : 500}" text-anchor="end" font-variant-numeric="tabular-nums"`));
    if (r < table.rows.length - 1) parts.push(`<rect x="${MARGIN}" y="${top + ROW_HEIGHT}" width="${CARD_WIDTH - 2 * MARGIN}" height="2" fill="${colours.ink}" opacity="0.25"/>`);
  });

  const foot = CARD_HEIGHT - 40;
  text(MARGIN, foot, 28, clip(input.channelName, 60), ` font-weight="600"`);
  if (table.more > 0) text(CARD_WIDTH - MARGIN, foot, 28, `${table.more} more run${table.more === 1 ? "" : "s"} on the bench`, ` text-anchor="end"`);

  const style = fontFaces ? `<style>${fontFaces}</style>` : "";
  const summary = table.rows.map((row) => `Run ${row.number}, ${row.label}: ${verdictLabels[row.verdict].toLowerCase()}${row.best ? ", best" : ""}.`).join(" ");
  return [
    `<svg xmlns="http://www.w3.org/2000/svg" width="${CARD_WIDTH}" height="${CARD_HEIGHT}" viewBox="0 0 ${CARD_WIDTH} ${CARD_HEIGHT}" font-family="${FONT.replace(/"/g, "&quot;")}" role="img">`,
    `<title>${svgText(`Bench result: ${input.title}`)}</title><desc>${svgText(summary)}</desc>${style}`,
    ...parts,
    "</svg>",
  ].join("\n");
}
