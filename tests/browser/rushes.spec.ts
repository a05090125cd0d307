import { createHash } from "node:crypto";
import { mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { expect, test, type Page } from "@playwright/test";
import { parse as parseCsv } from "csv-parse/sync";
import { parseEdl } from "../../shared/rushes/exports/edl-parse";
import { hostWithEpisode, member, signInOn, snap, sql } from "./support";

const fixtures = path.resolve(import.meta.dirname, "../fixtures/rushes");
const storage = process.env.KERF_TEST_S3_ENDPOINT ?? "http://127.0.0.1:4568";

/** A file the browser can't decode, big enough for five 8 MiB parts. */
function largeFile(): string {
  const dir = mkdtempSync(path.join(os.tmpdir(), "kerf-rushes-"));
  const file = path.join(dir, "C003_WIDE.mov");
  const bytes = Buffer.alloc(36 * 1024 * 1024);
  for (let i = 0; i < bytes.length; i += 4096) bytes[i] = i & 0xff;
  writeFileSync(file, bytes);
  return file;
}

const upload = (page: Page, name: string) => page.getByRole("listitem", { name: `Upload of ${name}` });

test("an editor plans the shoot, uploads three files, pauses, reloads, marks and exports", async ({ page, browser }) => {
  test.setTimeout(240_000);
  // The host sets up the channel and the episode in a browser of their own, and brings in an editor.
  const hostContext = await browser.newContext();
  const { channelId, episodeId } = await hostWithEpisode(await hostContext.newPage(), {
    host: { name: "Oda Tveit", channel: "Slipway Rocketry" },
    episode: { title: "Two-stage water rocket", question: "Does a second stage beat one bigger bottle?", origin: "idea", stage: "shoot" },
  });
  await hostContext.close();
  const editor = await member(channelId, "Ivar Moen", "editor");
  // The editor does the rest, on the test's own page (its trace is kept when the journey fails).
  await signInOn(page, editor.email);
  await expect(page.getByText("Editor", { exact: true })).toBeVisible();
  await page.goto(`/c/${channelId}/episodes/${episodeId}`);
  await expect(page.getByRole("heading", { name: "Shoot days and shots" })).toBeVisible();

  // The shoot plan: one day, two shots on it; each form opens from its button.
  await page.getByRole("button", { name: "Add a shoot day" }).click();
  const dayForm = page.getByRole("form", { name: "Add a shoot day" });
  await dayForm.getByLabel("Call time").fill("7 am");
  await dayForm.getByRole("button", { name: "Add day" }).click();
  await expect(dayForm.getByText("Write the date as YYYY-MM-DD.")).toBeVisible();
  await expect(dayForm.getByText("Write the call time as HH:MM, 24-hour.")).toBeVisible();
  await snap(page, "rushes-01-shoot-day-errors");
  await dayForm.getByLabel("Date").fill("2026-12-12");
  await dayForm.getByLabel("Place").fill("Harbour slipway");
  await dayForm.getByLabel("Call time").fill("07:00");
  await dayForm.getByRole("button", { name: "Add day" }).click();
  await expect(page.getByRole("link", { name: "Sat 12 Dec 2026 · Harbour slipway" })).toBeVisible();

  await expect(dayForm).toHaveCount(0);
  await page.getByRole("button", { name: "Add a shot" }).click();
  const shotForm = page.getByRole("form", { name: "Add a shot" });
  for (const [description, kind] of [
    ["Stage separation in slow motion", "slow_motion"],
    ["Host explains the coupler", "talking_head"],
  ] as const) {
    await shotForm.getByLabel("Shot", { exact: true }).fill(description);
    await shotForm.getByLabel("Kind").selectOption(kind);
    await shotForm.getByLabel("Shoot day").selectOption({ label: "Sat 12 Dec 2026 Harbour slipway" });
    await shotForm.getByRole("button", { name: "Add shot" }).click();
    await expect(page.getByRole("list", { name: "Shots" }).getByText(description)).toBeVisible();
  }
  await snap(page, "rushes-02-shot-list");
  await page.getByRole("navigation", { name: "Parts of the episode" }).getByRole("link", { name: "Footage" }).click();

  // Storage answers slowly enough to pause; part 2 of the large file fails every try (each after a
  // longer wait) until the person asks for Retry.
  let refusePartTwo = true;
  await page.route(`${storage}/**`, async (route) => {
    const url = new URL(route.request().url());
    if (route.request().method() === "PUT") {
      await new Promise((r) => setTimeout(r, 400));
      if (url.searchParams.get("partNumber") === "2" && (route.request().postDataBuffer()?.length ?? 0) > 1e6 && refusePartTwo) {
        return route.abort("connectionreset");
      }
    }
    await route.continue();
  });

  const big = largeFile();
  await page.getByLabel("Camera files").setInputFiles([path.join(fixtures, "A001_C001.mov"), path.join(fixtures, "B002_C004.mp4"), big]);
  await expect(upload(page, "A001_C001.mov").getByText(/^Stored/)).toBeVisible({ timeout: 30_000 });
  await expect(upload(page, "B002_C004.mp4").getByText(/^Stored/)).toBeVisible({ timeout: 30_000 });

  // The large one: it stops on the failing part; Retry sends just that part.
  await expect(upload(page, "C003_WIDE.mov").getByText("Some parts didn't reach storage. Retry sends just those.")).toBeVisible({ timeout: 60_000 });
  await snap(page, "rushes-03-part-failed");
  refusePartTwo = false;
  await upload(page, "C003_WIDE.mov").getByRole("button", { name: "Retry" }).click();
  await upload(page, "C003_WIDE.mov").getByRole("button", { name: "Pause" }).click();
  await expect(upload(page, "C003_WIDE.mov").getByText(/^Paused/)).toBeVisible();
  await snap(page, "rushes-04-paused");

  // Reload mid-upload: the server remembers the parts; choosing the file again carries on from them.
  await page.reload();
  await expect(upload(page, "C003_WIDE.mov").getByText(/Unfinished: choose this file again/)).toBeVisible();
  const stored = Number((await upload(page, "C003_WIDE.mov").textContent())!.match(/(\d) of 5 parts stored/)![1]);
  expect(stored).toBeGreaterThan(0);
  expect(stored).toBeLessThan(5);
  await snap(page, "rushes-05-after-reload");
  await page.getByLabel("Camera files").setInputFiles(big);
  await expect(upload(page, "C003_WIDE.mov").getByText(/^Stored/)).toBeVisible({ timeout: 60_000 });
  await expect(page.getByRole("progressbar", { name: "All files" })).toHaveAttribute("aria-valuenow", "100");
  await page.unroute(`${storage}/**`);

  // Metadata and poster frames in the episode's footage list.
  const footage = page.getByRole("table");
  await expect(footage.getByRole("row", { name: /A001_C001\.mov/ })).toContainText("01:00:00;00");
  await expect(footage.getByRole("row", { name: /B002_C004\.mp4/ })).toContainText("10:00:00:00");
  await expect(page.getByTestId("footage-totals")).toContainText("3 clips");
  await expect(footage.getByRole("row", { name: /A001_C001\.mov/ }).locator("img")).toBeVisible({ timeout: 15_000 });
  await snap(page, "rushes-06-footage");

  // Link the drop-frame clip to its shot, rate it, and mark the separation.
  await footage.getByRole("button", { name: "A001_C001.mov" }).click();
  const panel = page.getByRole("dialog");
  await expect(panel.getByLabel("Clip facts")).toContainText("01:00:00;00 · 29.97 fps drop-frame");
  // The browser hashed the file beside the upload (shared/rushes/sha256.ts in a worker).
  const sha256 = createHash("sha256").update(readFileSync(path.join(fixtures, "A001_C001.mov"))).digest("hex");
  await expect(panel.getByLabel("Clip facts")).toContainText(`SHA-256 ${sha256}`);
  const log = panel.getByRole("form", { name: "Log this clip" });
  await log.getByLabel("Shot").selectOption({ label: "Stage separation in slow motion" });
  await log.getByLabel("Rating").selectOption("select");
  await log.getByLabel("Tags (comma between)").fill("separation, water");
  await log.getByRole("button", { name: "Save log" }).click();
  await expect(log.getByText("Log saved.")).toBeVisible();

  const marks = panel.getByRole("form", { name: "Add a mark" });
  await marks.getByLabel("In", { exact: true }).fill("01:00:01;00");
  await marks.getByLabel("Out", { exact: true }).fill("01:01:00;00");
  await marks.getByRole("button", { name: "Add mark" }).click();
  await expect(marks.getByText(/01:01:00;00 does not exist in 29.97 fps drop-frame/)).toBeVisible();
  await marks.getByLabel("Out", { exact: true }).fill("01:00:00;10");
  await marks.getByRole("button", { name: "Add mark" }).click();
  await expect(marks.getByText("The out point 01:00:00;10 must come after the in point 01:00:01;00")).toBeVisible();
  await snap(page, "rushes-07-mark-errors");
  await marks.getByLabel("Out", { exact: true }).fill("01:00:02;15");
  await marks.getByLabel("Note", { exact: true }).fill("the upper stage lets go");
  await marks.getByRole("button", { name: "Add mark" }).click();
  await expect(panel.getByRole("list", { name: "Marks on this clip" })).toContainText("01:00:01;00 → 01:00:02;15");
  await snap(page, "rushes-08-marked");
  await panel.getByRole("button", { name: "Close" }).click();

  // Filter by rating: the URL holds the filter.
  const filters = page.getByRole("form", { name: "Filter footage" });
  await filters.getByLabel("Rating").selectOption("select");
  await filters.getByRole("button", { name: "Apply filters" }).click();
  await expect(page).toHaveURL(/rating=select/);
  await expect(page.getByTestId("footage-totals")).toContainText("1 clip");
  await snap(page, "rushes-09-filtered");

  // Exports of the current filter, read back.
  const read = async (name: RegExp) => {
    const [download] = await Promise.all([page.waitForEvent("download"), page.getByRole("link", { name }).click()]);
    return readFileSync((await download.path())!, "utf8");
  };
  const csv: string[][] = parseCsv(await read(/^CSV$/), { record_delimiter: "\r\n" });
  expect(csv).toHaveLength(2);
  expect(csv[1]!.slice(13, 16)).toEqual(["01:00:01;00", "01:00:02;15", "the upper stage lets go"]);
  const edl = parseEdl(await read(/EDL/));
  expect(edl.dropFrame).toBe(true);
  expect(edl.events[0]).toMatchObject({ sourceIn: "01:00:01;00", sourceOut: "01:00:02;15", recordIn: "01:00:00;00", recordOut: "01:00:01;15" });
  const otio = JSON.parse(await read(/OpenTimelineIO/));
  expect(otio.tracks.children[0].children[0].source_range.duration.value).toBe(45);

  // The crew's view of the day: the linked shot is captured, the other still missing.
  await page.goto(`/c/${channelId}/episodes/${episodeId}/shoot`);
  await page.getByRole("link", { name: "Sat 12 Dec 2026 · Harbour slipway" }).click();
  const missing = page.getByRole("region", { name: /Still to get/ });
  await expect(page.getByRole("heading", { name: "Still to get (1)" })).toBeVisible();
  await expect(missing.getByText("Host explains the coupler")).toBeVisible();
  await expect(page.getByText("Stage separation in slow motion")).toBeVisible();
  await snap(page, "rushes-10-crew-day");
});

test("an editor whose footage mixes frame rates is told so and takes one EDL per rate, each in its clips' own timecode", async ({ page, browser }) => {
  const hostContext = await browser.newContext();
  const { channelId, episodeId } = await hostWithEpisode(await hostContext.newPage(), {
    host: { name: "Runa Holt", channel: "Bench Grinder Notes" },
    episode: { title: "Belt sander teardown", question: "Where does the belt slip?", origin: "idea", stage: "shoot" },
  });
  await hostContext.close();
  const clip = (name: string, rate: [number, number], dropFrame: boolean, start: string, minute: number) =>
    sql(
      `insert into clips (channel_id, episode_id, object_key, file_name, content_type, size_bytes, duration_ms, frame_rate_numerator, frame_rate_denominator, drop_frame, start_timecode, recorded_at)
       values ($1, $2, $3, $4, 'video/quicktime', 1000, 2002, $5, $6, $7, $8, $9)`,
      [channelId, episodeId, `${channelId}/${episodeId}/${name}`, name, rate[0], rate[1], dropFrame, start, new Date(Date.UTC(2026, 11, 14, 9, minute))],
    );
  await clip("A001_C001.mov", [30000, 1001], true, "00:59:58;00", 1);
  await clip("B001_C001.mov", [25, 1], false, "14:10:00:00", 2);
  await clip("B001_C002.mov", [25, 1], false, "14:20:00:00", 3);
  const editor = await member(channelId, "Sigve Aas", "editor");
  await signInOn(page, editor.email);
  await page.goto(`/c/${channelId}/rushes`);

  const note = page.getByRole("note", { name: "Frame rates of this filter" });
  await expect(note).toContainText("These clips were shot at 2 frame rates. An EDL holds one rate, and Kerf never converts a clip's timecode");
  await expect(page.getByRole("link", { name: "EDLs, one per rate (zip)" })).toBeVisible();
  await snap(page, "rushes-11-mixed-rates");
  const [download] = await Promise.all([page.waitForEvent("download"), note.getByRole("link", { name: "EDL at 25 fps non-drop-frame" }).click()]);
  expect(download.suggestedFilename()).toMatch(/^footage-\d{4}-\d{2}-\d{2}-25\.edl$/);
  const edl = parseEdl(readFileSync((await download.path())!, "utf8"));
  // Most recent first (the list's order); 2.002 s at 25 fps is 50 frames: 2 s.
  expect(edl.events.map((e) => [e.reel, e.sourceIn, e.sourceOut])).toEqual([
    ["B001C002", "14:20:00:00", "14:20:02:00"],
    ["B001C001", "14:10:00:00", "14:10:02:00"],
  ]);

  // On a phone the note wraps with the page, which never scrolls sideways.
  await page.setViewportSize({ width: 390, height: 844 });
  await expect(note).toBeVisible();
  expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
  await snap(page, "rushes-12-mixed-rates-phone");
});
