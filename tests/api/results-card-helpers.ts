import { seedDemo } from "../../dev-services/demo/channel";
import type { TestApp } from "../support/test-app";

/** The demo channel, seeded into the app's database, and its episode with bench runs: the card's subject. */
export async function demoCardEpisode(app: TestApp): Promise<{ channelId: string; episodeId: string; base: string }> {
  await seedDemo(app.db, new Date("2026-12-02T08:00:00Z"));
  const [row] = (await app.database.pool.query("select channel_id, id from episodes where title = 'Case fans versus one big rotor'")).rows;
  return { channelId: row.channel_id, episodeId: row.id, base: `/api/channels/${row.channel_id}/episodes/${row.id}` };
}
