import { roleMay } from "../../shared/access/roles";
import { homeGroupsByRole, needGroupLabels, type HomeView, type NeedEntry } from "../../shared/home/needs";
import { localDate } from "../../shared/slate/dates";
import type { Database } from "../db/client";
import type { Caller } from "../http/route-table";
import type { NeedSource } from "../seams/home-needs";

/** Dated entries soonest first (late ones lead); undated ones keep their source's order after them. */
function byDate(a: NeedEntry, b: NeedEntry): number {
  if (a.date === b.date) return 0;
  if (a.date === null) return 1;
  if (b.date === null) return -1;
  return a.date < b.date ? -1 : 1;
}

/**
 * The caller's home: the groups their role works in, each from the sources that fill it. A source is
 * asked only when the role may read its area, so an entry never shows what the role may not see.
 */
export async function homeOf(db: Database, sources: readonly NeedSource[], caller: Caller, now = new Date()): Promise<HomeView> {
  const today = localDate(now, caller.timeZone);
  const viewer = { ...caller, today };
  const groups = await Promise.all(
    homeGroupsByRole[caller.role].map(async (group) => {
      const asked = sources.filter((source) => source.group === group && roleMay(caller.role, source.area, "R"));
      const entries = (await Promise.all(asked.map((source) => source.needsFor(db, viewer)))).flat();
      return { group, label: needGroupLabels[group], entries: [...entries].sort(byDate) };
    }),
  );
  return { today, timeZone: caller.timeZone, groups };
}
