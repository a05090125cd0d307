import { z } from "zod";
import { readCsvRows } from "../csv/csv";
import { oneLine } from "../fields/text";

/** The figures a sponsor deal asks for after go-live, each counted on an agreed day. */
export const figureKinds = ["views", "watchHours", "linkClicks", "codeUses"] as const;
export type FigureKind = (typeof figureKinds)[number];

export const figureLabels: Record<FigureKind, string> = {
  views: "Views",
  watchHours: "Watch time (hours)",
  linkClicks: "Link clicks",
  codeUses: "Code uses",
};

/** Watch time is kept to a tenth of an hour (six minutes); the others are counts. */
const wholeKinds: readonly FigureKind[] = ["views", "linkClicks", "codeUses"];
export type FigureValues = Record<FigureKind, number | null>;

export const MAX_FIGURE_DAY = 3660;
const figure = (kind: FigureKind) =>
  z
    .number({ error: `${figureLabels[kind]}: give a number.` })
    .min(0, `${figureLabels[kind]} can't be below 0.`)
    .max(1e12, `${figureLabels[kind]} is larger than any video's.`)
    .refine((n) => !wholeKinds.includes(kind) || Number.isInteger(n), `${figureLabels[kind]} is a whole number.`)
    .nullable();

export const figureValuesSchema = z.strictObject({ views: figure("views"), watchHours: figure("watchHours"), linkClicks: figure("linkClicks"), codeUses: figure("codeUses") });

export const figureSources = ["hand", "export"] as const;
export const figuresInputSchema = z.strictObject({
  /** The version the form opened with; 0 for a day with no figures yet. */
  version: z.number().int().min(0),
  values: figureValuesSchema.refine((v) => figureKinds.some((k) => v[k] !== null), "Give at least one figure."),
  source: z.enum(figureSources),
});
export type FiguresInput = z.infer<typeof figuresInputSchema>;

/** A figure day in a path: whole days after go-live. */
export const figureDaySchema = z.coerce.number({ error: "The day is a whole number of days after go-live." }).int().min(0).max(MAX_FIGURE_DAY);

/** Which column of the channel's analytics export holds each figure, and which names the video; set once per channel. */
const columnName = oneLine(200).nullable();
export const figureColumnsSchema = z.strictObject({ video: columnName, views: columnName, watchHours: columnName, linkClicks: columnName, codeUses: columnName });
export type FigureColumns = z.infer<typeof figureColumnsSchema>;

export interface FigureDayView {
  day: number;
  /** Go-live plus the day; null before go-live. */
  dueOn: string | null;
  /** A deal of the episode asks for the figures on this day. */
  agreed: boolean;
  version: number;
  values: FigureValues | null;
  source: (typeof figureSources)[number] | null;
  enteredAt: string | null;
  enteredBy: string | null;
}

export interface FiguresView {
  liveOn: string | null;
  videoUrl: string | null;
  days: FigureDayView[];
  columns: FigureColumns | null;
}

export interface ExportReading {
  values: FigureValues | null;
  /** The row of the file the figures came from (1 is the header). */
  row: number | null;
  problems: string[];
}

const emptyValues = (): FigureValues => ({ views: null, watchHours: null, linkClicks: null, codeUses: null });

/** "1,234", "1 234", "12.5" and "" (nothing) as an analytics export writes them; NaN for anything else. */
export function cellNumber(cell: string): number | null {
  const text = cell.replace(/[\s\u00a0,]/g, "");
  if (text === "" || text === "-") return null;
  return /^\d+(?:\.\d+)?$/.test(text) ? Number(text) : Number.NaN;
}

/** The video's own names in an export: its id from the link (?v=…, or the link's last part) and its title. */
export function videoKeys(videoUrl: string | null, title: string | null): string[] {
  const keys: string[] = [];
  if (videoUrl && URL.canParse(videoUrl)) {
    const url = new URL(videoUrl);
    const id = url.searchParams.get("v") ?? url.pathname.split("/").filter(Boolean).pop();
    if (id) keys.push(id);
  }
  if (title) keys.push(title);
  return keys.map((k) => k.trim().toLowerCase());
}

function pickRow(header: string[], rows: string[][], video: string | null, keys: string[]): { index: number } | { problem: string } {
  // Exports often open with a "Total" row across every video in the file.
  const candidates = rows.map((cells, index) => ({ cells, index })).filter(({ cells }) => !/^total$/i.test(cells[0] ?? ""));
  if (video === null) {
    return candidates.length === 1 ? { index: candidates[0]!.index } : { problem: `The file has ${candidates.length} rows of figures: name the column that says which video a row is, so Kerf can pick this one.` };
  }
  const column = header.indexOf(video);
  if (column < 0) return { problem: `The file has no column "${video}" (the one that names the video).` };
  const found = candidates.find(({ cells }) => keys.includes((cells[column] ?? "").trim().toLowerCase()));
  return found ? { index: found.index } : { problem: `No row's "${video}" is this video's id or title.` };
}

/** This video's figures from an analytics export, read through the channel's column names, for a preview before anything is written. */
export function figuresFromExport(text: string, columns: FigureColumns, keys: string[]): ExportReading {
  let table: ReturnType<typeof readCsvRows>;
  try {
    table = readCsvRows(text);
  } catch (error) {
    return { values: null, row: null, problems: [`The file is not a readable CSV export: ${(error as Error).message}`] };
  }
  const mapped = figureKinds.filter((kind) => columns[kind] !== null);
  if (mapped.length === 0) return { values: null, row: null, problems: ["Name the export's column for at least one figure first."] };
  const missing = mapped.filter((kind) => !table.header.includes(columns[kind]!));
  if (missing.length > 0) return { values: null, row: null, problems: missing.map((kind) => `The file has no column "${columns[kind]}" (${figureLabels[kind].toLowerCase()}).`) };
  const picked = pickRow(table.header, table.rows, columns.video, keys);
  if ("problem" in picked) return { values: null, row: null, problems: [picked.problem] };
  const cells = table.rows[picked.index]!;
  const values = emptyValues();
  const problems: string[] = [];
  for (const kind of mapped) {
    const value = cellNumber(cells[table.header.indexOf(columns[kind]!)] ?? "");
    if (value !== null && Number.isNaN(value)) problems.push(`${figureLabels[kind]}: "${cells[table.header.indexOf(columns[kind]!)]}" is not a number.`);
    else values[kind] = value === null ? null : wholeKinds.includes(kind) ? Math.round(value) : Math.round(value * 10) / 10;
  }
  return { values, row: picked.index + 2, problems };
}

/** A figure as the pages and the report write it: thousands grouped with commas, a tenth kept where there is one ("40,001", "2,500.5"). */
export function formatFigure(value: number): string {
  const [whole = "0", tenth] = (Math.round(value * 10) / 10).toFixed(1).split(".");
  const grouped = whole.replace(/\B(?=(\d{3})+(?!\d))/g, ",");
  return tenth && tenth !== "0" ? `${grouped}.${tenth}` : grouped;
}

/** Each figure kind with at least one value, as a series of points by day: what the figures chart draws. */
export function figureSeries(days: readonly { day: number; values: FigureValues | null }[]): { kind: FigureKind; name: string; points: { label: string; value: number }[] }[] {
  return figureKinds.flatMap((kind) => {
    const points = days.flatMap((d) => (d.values?.[kind] == null ? [] : [{ label: `Day ${d.day}`, value: d.values[kind] }]));
    return points.length === 0 ? [] : [{ kind, name: figureLabels[kind], points }];
  });
}
