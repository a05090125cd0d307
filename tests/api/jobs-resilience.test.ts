import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { ABANDONED_UPLOADS_QUEUE, scheduleRushesJobs } from "../../server/rushes/rushes.jobs";
import { REMINDER_QUEUE, scheduleSponsorJobs } from "../../server/sponsors/reminders";
import { dateInZone, shiftDate } from "../../shared/sponsors/dates";
import { createCrewedChannel } from "../factories/accounts";
import { createEpisode } from "../factories/episodes";
import { createItemDue } from "../factories/sponsors";
import { settledJobs } from "../support/jobs";
import { waitForMail } from "../support/mailbox";
import { startTestApp, type TestApp } from "../support/test-app";

/*
 * Background jobs run over every channel at once. Each test breaks one channel's rows straight in the
 * database (the API refuses such values) and runs the real scheduled job through pg-boss: the other
 * channel's work must still be done, and the job's output must count the failure.
 */
let app: TestApp;
beforeAll(async () => {
  app = await startTestApp();
  await scheduleSponsorJobs(app.jobs.boss, { db: app.db, pool: app.database.pool, jobs: app.jobs, appUrl: "http://kerf.test" } as Parameters<typeof scheduleSponsorJobs>[1], { pollSeconds: 0.5 });
  await scheduleRushesJobs(app.jobs.boss, { db: app.db, storage: app.deps.storage });
});
afterAll(() => app.close());

const sql = (text: string, values: unknown[] = []) => app.database.pool.query(text, values);

async function channelWithItemDue(name: string, due: (today: string) => string) {
  const world = await createCrewedChannel(app.db, name);
  const today = dateInZone(new Date(), world.producer.timeZone);
  const made = await createItemDue(app.db, world.channel.id, { ownerId: world.producer.id, dueDate: due(today), title: `${name} item`, company: `${name} Sponsor` });
  return { ...world, ...made };
}

/** Runs a scheduled job now, through pg-boss, and answers its settled row. */
async function runJob(queue: string) {
  const id = await app.jobs.boss.send(queue, {});
  const [job] = await settledJobs(app.database.pool, queue, (row) => row.id === id, 1, 60_000);
  return job!;
}

describe("one channel's broken rows in a background job", () => {
  it("when channel A has dates past year 9999, then the reminder scan still sends channel B's reminder on time, and counts A's failures", async () => {
    const broken = await channelWithItemDue("Broken", () => "2027-01-01");
    // A due date the derived-date computation cannot read, and a publish date whose catch-up throws.
    await sql("update deliverables set anchor = 'before_publish', due_date = '10000-01-05' where channel_id = $1", [broken.channel.id]);
    await sql("update episodes set target_publish_date = '10000-06-01' where id = $1", [broken.episode.id]);
    const healthy = await channelWithItemDue("Healthy", (today) => shiftDate(today, 2));

    const job = await runJob(REMINDER_QUEUE);
    expect(job.state).toBe("completed");
    expect(job.output).toMatchObject({ sent: 1, failed: 2 });
    const failures = (job.output as { failures: { item: string }[] }).failures.map((f) => f.item);
    expect(failures).toEqual([expect.stringContaining(`of channel ${broken.channel.id}`), expect.stringContaining(`of channel ${broken.channel.id}`)]);
    expect((await waitForMail(healthy.producer.email)).subject).toBe("Due soon: Healthy item (Healthy Sponsor)");
  }, 90_000);

  it("when one channel's abandoned upload cannot be marked, then the sweep still marks the other channel's, and counts the failure", async () => {
    const a = await createCrewedChannel(app.db, "Stuck Uploads");
    const b = await createCrewedChannel(app.db, "Tidy Uploads");
    const upload = async (world: typeof a, hoursAgo: number) => {
      const episode = await createEpisode(app.db, world.channel.id);
      const result = await sql(
        `insert into uploads (channel_id, episode_id, file_name, content_type, size_bytes, part_size, part_count, object_key, storage_upload_id, last_activity_at)
         values ($1, $2, 'A001.mov', 'video/quicktime', 100, 100, 1, $3, 'no-such-upload', now() - make_interval(hours => $4)) returning id`,
        [world.channel.id, episode.id, `${world.channel.id}/${episode.id}/${crypto.randomUUID()}`, hoursAgo],
      );
      return result.rows[0].id as string;
    };
    const stuck = await upload(a, 50);
    const tidy = await upload(b, 30);
    // A row the database refuses to change: the kind of fault that used to end the whole sweep.
    await sql(`create function refuse_stuck_upload() returns trigger language plpgsql as $$ begin
      if new.id = '${stuck}' then raise exception 'upload row % is damaged', new.id; end if; return new; end $$`);
    await sql("create trigger refuse_stuck_upload before update on uploads for each row execute function refuse_stuck_upload()");

    const job = await runJob(ABANDONED_UPLOADS_QUEUE);
    expect(job.state).toBe("completed");
    expect(job.output).toMatchObject({ failed: 1, failures: [{ item: `upload ${stuck} of channel ${a.channel.id}`, error: expect.stringContaining("damaged") }] });
    const states = await sql("select id, status::text from uploads where id = any($1) order by last_activity_at", [[stuck, tidy]]);
    expect(states.rows).toEqual([
      { id: stuck, status: "uploading" },
      { id: tidy, status: "abandoned" },
    ]);
  }, 60_000);
});
