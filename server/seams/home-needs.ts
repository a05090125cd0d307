import type { Area } from "../../shared/access/roles";
import type { NeedEntry, NeedGroup } from "../../shared/home/needs";
import type { Database } from "../db/client";
import type { Caller } from "../http/route-table";

/** Who is asking, with today's date in their own time zone (YYYY-MM-DD). */
export interface NeedViewer extends Caller {
  today: string;
}

/**
 * The home seam: a feature that knows something a member must act on exports `NeedSource`s from its
 * `<feature>.needs.ts`; server/app.ts lists them and hands the list to the home. A source answers for
 * one channel in a few queries and returns only what the viewer's role may read in `area`.
 */
export interface NeedSource {
  group: NeedGroup;
  /** The area the entries come from: a role that may not read it is never asked. */
  area: Area;
  needsFor(db: Database, viewer: NeedViewer): Promise<NeedEntry[]>;
}

/** The in-app path of a channel's page. */
export const channelPath = (channelId: string, rest: string) => `/c/${channelId}/${rest}`;
