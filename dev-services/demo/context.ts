import type { Role } from "../../shared/access/roles";
import type { Stage } from "../../shared/slate/stages";
import type { Database } from "../../server/db/client";

/** What the feature demos build on: the channel, its people by role, and its episodes (dev-services/demo/channel.ts makes it). */
export interface DemoContext {
  db: Database;
  today: Date;
  channelId: string;
  people: Map<Role, { id: string; email: string; name: string }>;
  episodes: { id: string; stage: Stage; title: string; targetPublishDate: string | null }[];
}

/** Every demo account's time zone. */
export const DEMO_TIME_ZONE = "Europe/Oslo";
