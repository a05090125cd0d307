import { mkdtempSync, writeFileSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { expect, test, type Page, type Route } from "@playwright/test";
import { hostWithEpisode, snap, sql } from "./support";

/*
 * Uploads that keep their progress. Storage's answers to part PUTs are held by the test (page.route)
 * until it opens a gate, so "30 %" is a number of recorded parts, not a moment; every wait is on the
 * page or on the parts Kerf recorded in the database, never on time.
 */
const storage = process.env.KERF_TEST_S3_ENDPOINT ?? "http://127.0.0.1:4568";
const MiB = 1024 * 1024;
const fixtures = path.resolve(import.meta.dirname, "../fixtures/rushes");

/** 44 MiB the browser can't decode: five 8 MiB parts and a 4 MiB one (Kerf's plan, shared/rushes/limits.ts). */
const partMiB = (n: number) => (n === 6 ? 4 : 8);
function sixPartFile(name: string, fill: number): string {
  const file = path.join(mkdtempSync(path.join(os.tmpdir(), "kerf-uploads-")), name);
  const bytes = Buffer.alloc(44 * MiB, fill);
  for (let i = 0; i < bytes.length; i += 4096) bytes[i] = (i / 4096) & 0xff;
  writeFileSync(file, bytes);
  return file;
}

const row = (page: Page, name: string) => page.getByRole("listitem", { name: `Upload of ${name}` });

/**
 * The first `open` parts whose PUT reaches storage go through; any other part waits, unanswered,
 * until `release()`. The part numbers PUT are kept in order.
 */
async function gateParts(page: Page, open: number) {
  let release!: () => void;
  const gate = new Promise<void>((resolve) => (release = resolve));
  const seen: number[] = [];
  const through = new Set<number>();
  const handler = async (route: Route) => {
    const request = route.request();
    const partNumber = Number(new URL(request.url()).searchParams.get("partNumber"));
    if (request.method() === "PUT" && partNumber > 0) {
      seen.push(partNumber);
      if (through.size < open) through.add(partNumber);
      if (!through.has(partNumber)) await gate;
    }
    // A part the page dropped meanwhile (paused, reloaded) has no route left to answer.
    await route.continue().catch(() => undefined);
  };
  await page.route(`${storage}/**`, handler);
  return { release: () => release(), seen, stop: () => page.unroute(`${storage}/**`, handler) };
}

/** Parts Kerf recorded for the channel's upload of this file. */
async function recordedParts(channelId: string, fileName: string): Promise<number[]> {
  const rows = await sql<{ part_number: number }>(
    `select p.part_number from upload_parts p join uploads u on u.id = p.upload_id
      where u.channel_id = $1 and u.file_name = $2 order by p.part_number`,
    [channelId, fileName],
  );
  return rows.map((r) => r.part_number);
}

/** Every value the file's progress bar shows, in order, recorded by the page itself as it changes. */
async function recordProgress(page: Page, barName: string) {
  await page.evaluate((name) => {
    const samples: number[] = [];
    (window as unknown as { progressSamples: number[] }).progressSamples = samples;
    const read = () => {
      const bar = document.querySelector(`[role="progressbar"][aria-label="${name}"]`);
      const value = bar ? Number(bar.getAttribute("aria-valuenow")) : null;
      if (value !== null && samples.at(-1) !== value) samples.push(value);
    };
    new MutationObserver(read).observe(document.body, { subtree: true, childList: true, attributes: true, attributeFilter: ["aria-valuenow"] });
    read();
  }, barName);
  return () => page.evaluate(() => (window as unknown as { progressSamples: number[] }).progressSamples);
}

async function hostOnEpisode(page: Page, channel: string) {
  const { channelId, episodeId } = await hostWithEpisode(page, {
    host: { name: "Ragna Dahl", channel },
    episode: { title: "Flywheel bench", question: "How much does a heavier rim store?", origin: "idea", stage: "shoot" },
  });
  await page.goto(`/c/${channelId}/episodes/${episodeId}/footage`);
  await expect(page.getByRole("heading", { name: "Upload footage" })).toBeVisible({ timeout: 60_000 });
  return { channelId, episodeId };
}

test("pausing at about 30 % keeps the stored parts: the bar never goes back by more than one part, and the upload goes on on another page", async ({ page }) => {
  test.setTimeout(360_000);
  const { channelId } = await hostOnEpisode(page, "Rim Speed Lab");
  const name = "F001_SPIN.mov";
  const file = sixPartFile(name, 1);
  const gate = await gateParts(page, 2);
  const samples = await recordProgress(page, `${name} progress`);

  await page.getByLabel("Camera files").setInputFiles(file);
  // Two of six parts through (about 30 %); the others are held on their way.
  await expect.poll(async () => (await recordedParts(channelId, name)).length, { timeout: 120_000 }).toBe(2);
  const kept = await recordedParts(channelId, name);
  await expect(row(page, name)).toContainText("2 of 6 parts stored");
  await row(page, name).getByRole("button", { name: "Pause" }).click();
  await expect(row(page, name).getByText(/^Paused/)).toBeVisible();
  // Paused: the parts already sent stay, as stored and as counted (two 8 MiB parts of 44 MiB: 36 %).
  await expect(row(page, name)).toContainText("2 of 6 parts stored");
  const keptPercent = Math.floor((kept.reduce((s, n) => s + partMiB(n), 0) / 44) * 100);
  await expect(page.getByRole("progressbar", { name: `${name} progress` })).toHaveAttribute("aria-valuenow", String(keptPercent));
  expect(await recordedParts(channelId, name)).toEqual(kept);
  await snap(page, "uploads-01-paused");

  // Resume, then go elsewhere in Kerf: the band under the top bar follows the upload.
  const before = gate.seen.length;
  await row(page, name).getByRole("button", { name: "Resume" }).click();
  await page.getByRole("navigation", { name: "Channel pages" }).getByRole("link", { name: "Slate" }).click();
  const band = page.getByRole("list", { name: "Work in progress" });
  await expect(band).toContainText(`Uploading ${name}`);
  await snap(page, "uploads-02-band-on-another-page");
  gate.release();
  await expect.poll(() => recordedParts(channelId, name), { timeout: 120_000 }).toEqual([1, 2, 3, 4, 5, 6]);
  await expect(band).toBeHidden({ timeout: 120_000 });
  // After the resume only the missing parts went to storage again.
  expect(gate.seen.slice(before).filter((n) => kept.includes(n))).toEqual([]);
  await page.goBack();
  await expect(row(page, name).getByText(/^Stored/)).toBeVisible({ timeout: 120_000 });
  await gate.stop();

  // One part of this file is 8 MiB of 44: 18 % (rounded down, so a drop may read one point more).
  const values = await samples();
  expect(values.length).toBeGreaterThan(2);
  const drops = values.slice(1).map((v, i) => values[i]! - v);
  expect(Math.max(0, ...drops)).toBeLessThanOrEqual(Math.floor((8 / 44) * 100) + 1);
  expect(await sql("select id from clips where channel_id = $1 and file_name = $2", [channelId, name])).toHaveLength(1);
});

test("after a reload, choosing the same file again sends only the parts Kerf has no record of", async ({ page }) => {
  test.setTimeout(360_000);
  const { channelId } = await hostOnEpisode(page, "Reload Works");
  const name = "G002_LONG.mov";
  const file = sixPartFile(name, 2);
  const first = await gateParts(page, 3);
  await page.getByLabel("Camera files").setInputFiles(file);
  await expect.poll(async () => (await recordedParts(channelId, name)).length, { timeout: 120_000 }).toBe(3);
  const kept = await recordedParts(channelId, name);
  await expect(row(page, name)).toContainText("3 of 6 parts stored");

  // Leaving a page with files on their way asks first; the person confirms.
  page.on("dialog", (dialog) => void dialog.accept());
  await page.reload();
  await first.stop();
  await expect(row(page, name).getByText(/Unfinished: choose this file again/)).toBeVisible({ timeout: 60_000 });
  await expect(row(page, name)).toContainText("3 of 6 parts stored");

  const after = await gateParts(page, 6);
  await page.getByLabel("Camera files").setInputFiles(file);
  await expect(row(page, name).getByText(/^Stored/)).toBeVisible({ timeout: 120_000 });
  expect([...new Set(after.seen)].sort()).toEqual([1, 2, 3, 4, 5, 6].filter((n) => !kept.includes(n)));
  const uploads = await sql<{ status: string }>("select status from uploads where channel_id = $1 and file_name = $2", [channelId, name]);
  expect(uploads).toEqual([{ status: "completed" }]);
  await after.stop();
});

test("a file the channel already has is flagged before it is sent; the person cancels or sends it anyway", async ({ page }) => {
  test.setTimeout(360_000);
  const { channelId } = await hostOnEpisode(page, "Twice Filed");
  const clip = path.join(fixtures, "A001_C001.mov");
  await page.getByLabel("Camera files").setInputFiles(clip);
  await expect(row(page, "A001_C001.mov").getByText(/^Stored/)).toBeVisible({ timeout: 120_000 });
  await row(page, "A001_C001.mov").getByRole("button", { name: "Clear" }).click();

  await page.getByLabel("Camera files").setInputFiles(clip);
  await expect(row(page, "A001_C001.mov")).toContainText('This file is already in the channel as A001_C001.mov (episode “Flywheel bench”).');
  await snap(page, "uploads-03-already-in-channel");
  // At phone size the flag and its choices fit without sideways scrolling.
  await page.setViewportSize({ width: 390, height: 844 });
  expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
  await row(page, "A001_C001.mov").scrollIntoViewIfNeeded();
  await snap(page, "uploads-04-already-in-channel-phone");
  await page.setViewportSize({ width: 1280, height: 720 });
  await row(page, "A001_C001.mov").getByRole("button", { name: "Cancel" }).click();
  await expect(row(page, "A001_C001.mov").getByText(/^Cancelled/)).toBeVisible();
  // Flagged before sending: no second upload was even opened.
  expect(await sql("select id from uploads where channel_id = $1", [channelId])).toHaveLength(1);
  await row(page, "A001_C001.mov").getByRole("button", { name: "Clear" }).click();

  await page.getByLabel("Camera files").setInputFiles(clip);
  await row(page, "A001_C001.mov").getByRole("button", { name: "Upload anyway" }).click();
  await expect(row(page, "A001_C001.mov").getByText(/^Stored/)).toBeVisible({ timeout: 120_000 });
  expect(await sql("select id from clips where channel_id = $1", [channelId])).toHaveLength(2);
});
