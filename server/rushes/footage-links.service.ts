import type { FootageLinks, ShowingFootage } from "../../shared/rushes/schemas";
import type { Caller } from "../http/route-table";
import { posterKeyOf, posterUrlOf } from "./clips.service";
import * as repo from "./footage-links.repository";
import type { RushesContext } from "./rushes.context";

/** How many of the episode's clips the link menus offer (newest first). */
export const LINKABLE_CLIPS = 500;

/** The episode's runs and iterations, each with the clips and marks that show it, and the clips to link. */
export async function footageLinks(ctx: RushesContext, caller: Caller, episodeId: string): Promise<FootageLinks> {
  const { channelId } = caller;
  // One snapshot for the five reads, so a link moved meanwhile is never counted twice or lost.
  // One after another: a transaction is one connection, which takes one query at a time.
  const [runs, iterations, clips, linked, marks] = await ctx.db.transaction(
    async (tx) =>
      [
        await repo.episodeRuns(tx, channelId, episodeId),
        await repo.episodeIterations(tx, channelId, episodeId),
        await repo.episodeClips(tx, channelId, episodeId, LINKABLE_CLIPS + 1),
        await repo.linkedClips(tx, channelId, episodeId),
        await repo.linkedMarks(tx, channelId, episodeId),
      ] as const,
    { isolationLevel: "repeatable read", accessMode: "read only" },
  );
  const byRun = new Map<string, ShowingFootage[]>(runs.map((r) => [r.id, []]));
  const byIteration = new Map<string, ShowingFootage[]>(iterations.map((i) => [i.id, []]));
  const place = (item: ShowingFootage, runId: string | null, iterationId: string | null) => {
    if (runId) byRun.get(runId)?.push(item);
    if (iterationId) byIteration.get(iterationId)?.push(item);
  };
  for (const clip of linked) {
    place({ clipId: clip.id, fileName: clip.fileName, posterUrl: await posterUrlOf(ctx, posterKeyOf(clip)), mark: null }, clip.benchRunId, clip.buildIterationId);
  }
  for (const m of marks) {
    const mark = { id: m.id, in: m.inLabel, out: m.outLabel, note: m.note };
    place({ clipId: m.clipId, fileName: m.fileName, posterUrl: await posterUrlOf(ctx, posterKeyOf(m)), mark }, m.benchRunId, m.buildIterationId);
  }
  return {
    runs: runs.map((r) => ({ ...r, footage: byRun.get(r.id) ?? [] })),
    iterations: iterations.map((i) => ({ ...i, footage: byIteration.get(i.id) ?? [] })),
    clips: clips.slice(0, LINKABLE_CLIPS).map((c) => ({ id: c.id, fileName: c.fileName, benchRunId: c.benchRunId, buildIterationId: c.buildIterationId })),
    moreClips: clips.length > LINKABLE_CLIPS,
  };
}
