import { calendarPlugs } from "../../server/app";
import { feedText } from "../../server/calendar/feeds.service";
import { connectDatabase } from "../../server/db/client";

/**
 * Prints one feed as the server makes it, in a process of its own: the calendar test runs this with
 * different TZ settings and compares the dates. Reads DATABASE_URL, FEED_TOKEN and FEED_NOW.
 */
const handle = connectDatabase(process.env.DATABASE_URL!);
try {
  process.stdout.write(await feedText(handle.db, calendarPlugs.sources, process.env.FEED_TOKEN!, "http://kerf.test", new Date(process.env.FEED_NOW!)));
} finally {
  await handle.close();
}
