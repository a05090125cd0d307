import { figureKinds, type FigureDayView, type FigureColumns, type FiguresInput, type FiguresView } from "../../shared/publish/figures";
import { dateInZone, shiftDate } from "../../shared/sponsors/dates";
import type { Queryable } from "../db/client";
import { AppError, staleSave } from "../http/app-error";
import type { Caller } from "../http/route-table";
import { readPublishFacts } from "../seams/publish-sources";
import { findFigureColumns, insertFigures, listFigures, saveFigureColumns, updateFigures } from "./figures.repository";
import { findPackage } from "./package.repository";
import type { PublishContext } from "./publish.context";

/** The figure days: those the episode's deals agreed, and any day figures were entered on; each dated from go-live. */
export async function figuresView(ctx: PublishContext, db: Queryable, channelId: string, episodeId: string): Promise<FiguresView> {
  const [pkg, facts, rows, columns] = await Promise.all([findPackage(db, channelId, episodeId), readPublishFacts(ctx.sources, db, { channelId, episodeId }), listFigures(db, channelId, episodeId), findFigureColumns(db, channelId)]);
  const liveOn = pkg?.publishedAt ? dateInZone(pkg.publishedAt, pkg.timeZone) : null;
  const days = [...new Set([...facts.figureDays, ...rows.map((r) => r.figures.day)])].sort((a, b) => a - b);
  return {
    liveOn,
    videoUrl: pkg?.videoUrl ?? null,
    columns,
    days: days.map((day): FigureDayView => {
      const row = rows.find((r) => r.figures.day === day);
      const f = row?.figures;
      return {
        day,
        dueOn: liveOn ? shiftDate(liveOn, day) : null,
        agreed: facts.figureDays.includes(day),
        version: f?.version ?? 0,
        values: f ? { views: f.views, watchHours: f.watchHours, linkClicks: f.linkClicks, codeUses: f.codeUses } : null,
        source: f?.source ?? null,
        enteredAt: f?.updatedAt.toISOString() ?? null,
        enteredBy: row?.enteredByName ?? null,
      };
    }),
  };
}

/** The day's figures, whole, against the version the form opened with; only once the video is live. */
export async function enterFigures(ctx: PublishContext, caller: Caller, episodeId: string, day: number, input: FiguresInput): Promise<FiguresView> {
  return ctx.db.transaction(async (tx) => {
    const pkg = await findPackage(tx, caller.channelId, episodeId);
    if (!pkg?.publishedAt) throw new AppError("conflict", "Figures count from go-live: mark the video published first.");
    const values = Object.fromEntries(figureKinds.map((k) => [k, input.values[k]])) as FiguresInput["values"];
    const entry = { ...values, source: input.source, enteredBy: caller.userId };
    const row = input.version === 0 ? await insertFigures(tx, caller.channelId, episodeId, day, entry) : await updateFigures(tx, caller.channelId, episodeId, day, input.version, entry);
    if (!row) throw staleSave("day's figures", await figuresView(ctx, tx, caller.channelId, episodeId));
    return figuresView(ctx, tx, caller.channelId, episodeId);
  });
}

export async function changeFigureColumns(ctx: PublishContext, channelId: string, columns: FigureColumns): Promise<FigureColumns> {
  await saveFigureColumns(ctx.db, channelId, columns);
  return columns;
}
