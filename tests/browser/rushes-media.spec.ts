import { execFile } from "node:child_process";
import { mkdtemp, rm, writeFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";
import { promisify } from "node:util";
import { expect, test } from "@playwright/test";
import { expectNoSeriousA11yViolations } from "./axe";
import { hostWithEpisode, member, signInOn, snap, sql } from "./support";

/*
 * The server's poster and proxy, seen on the page. The HEVC file is made here with ffmpeg's own test
 * sources (Chromium on Debian can't decode HEVC, so the browser sends no poster of its own):
 *   ffmpeg -f lavfi -i testsrc=size=320x180:rate=25:duration=1.5 -f lavfi -i sine=frequency=440:duration=1.5
 *     -c:v libx265 -preset ultrafast -tag:v hvc1 -c:a aac -shortest C010_HEVC.mp4
 * The broken file is 20,000 bytes of a pattern, named as a QuickTime file.
 */
const run = promisify(execFile);
let folder: string;
let hevc: string;
let broken: string;

test.beforeAll(async () => {
  folder = await mkdtemp(path.join(tmpdir(), "kerf-media-e2e-"));
  hevc = path.join(folder, "C010_HEVC.mp4");
  broken = path.join(folder, "C011_BROKEN.mov");
  await run("ffmpeg", [
    "-hide_banner", "-loglevel", "error", "-y",
    "-f", "lavfi", "-i", "testsrc=size=320x180:rate=25:duration=1.5", "-f", "lavfi", "-i", "sine=frequency=440:duration=1.5",
    "-c:v", "libx265", "-preset", "ultrafast", "-x265-params", "log-level=error", "-tag:v", "hvc1", "-c:a", "aac", "-shortest", hevc,
  ]);
  await writeFile(broken, Buffer.from(Array.from({ length: 20_000 }, (_, i) => (i * 31 + 7) & 0xff)));
});
test.afterAll(() => rm(folder, { recursive: true, force: true }));

test("the server makes a poster and proxy for an HEVC clip, and a file it can't read says why and offers a retry", async ({ page, browser }) => {
  test.setTimeout(300_000);
  const hostContext = await browser.newContext();
  const { channelId, episodeId } = await hostWithEpisode(await hostContext.newPage(), {
    host: { name: "Ilse Varga", channel: "Kiln Notes" },
    episode: { title: "Ceramic nozzle", question: "Does a fired nozzle outlast brass?", origin: "idea", stage: "shoot" },
  });
  await hostContext.close();
  const editor = await member(channelId, "Tomasz Brandt", "editor");
  await signInOn(page, editor.email);
  await page.goto(`/c/${channelId}/episodes/${episodeId}/footage`);
  await page.getByLabel("Camera files").setInputFiles([hevc, broken]);
  await expect(page.getByRole("listitem", { name: "Upload of C010_HEVC.mp4" }).getByText(/^Stored/)).toBeVisible({ timeout: 30_000 });
  await expect(page.getByRole("listitem", { name: "Upload of C011_BROKEN.mov" }).getByText(/^Stored/)).toBeVisible({ timeout: 30_000 });

  // The HEVC clip's row gets the server's poster, a picture that loaded.
  const hevcRow = page.getByRole("row", { name: /C010_HEVC\.mp4/ });
  const poster = hevcRow.locator("img");
  await expect(poster).toBeVisible({ timeout: 60_000 });
  await expect.poll(() => poster.evaluate((img: HTMLImageElement) => img.naturalWidth), { timeout: 15_000 }).toBe(480);
  await expect(hevcRow.getByText("Making poster and proxy…")).toHaveCount(0);

  // The file the server can't read says so in the list and in its panel, with a retry.
  const brokenRow = page.getByRole("row", { name: /C011_BROKEN\.mov/ });
  await expect(brokenRow.getByText(/No poster or proxy: Reading the file's details failed/)).toBeVisible({ timeout: 60_000 });
  await brokenRow.getByRole("button", { name: "C011_BROKEN.mov" }).click();
  const panel = page.getByRole("dialog");
  const failure = panel.getByRole("alert").filter({ hasText: "No poster or proxy" });
  await expect(failure).toContainText("the file may be damaged, unfinished or not a video the server can read.");
  await expect(failure.getByRole("button", { name: "Retry poster and proxy" })).toBeVisible();
  await snap(page, "media-01-failed-desk");
  await expectNoSeriousA11yViolations(page, "clip panel with a failed poster and proxy");
  await page.setViewportSize({ width: 390, height: 844 });
  await expect(failure).toBeVisible();
  expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
  await snap(page, "media-02-failed-phone");
  await page.setViewportSize({ width: 1280, height: 800 });
  await panel.getByRole("button", { name: "Close" }).click();

  // Waiting shows in the list and is looked at again until it changes; a failure (both set straight
  // in the database here) retries to ready.
  const [clip] = await sql<{ id: string }>("select id from clips where file_name = $1 and channel_id = $2", ["C010_HEVC.mp4", channelId]);
  await sql("update clips set media_state = 'waiting' where id = $1", [clip!.id]);
  // Nothing on the page is pending, so nothing polls: the page is opened again, as a person would.
  await page.reload();
  await expect(hevcRow.getByText("Making poster and proxy…")).toBeVisible({ timeout: 15_000 });
  await sql("update clips set media_state = 'failed', media_failure = $2 where id = $1", [clip!.id, "Footage storage could not be reached while making the poster and proxy; retry in a moment."]);
  await expect(hevcRow.getByText(/No poster or proxy: Footage storage could not be reached/)).toBeVisible({ timeout: 15_000 });
  await hevcRow.getByRole("button", { name: "C010_HEVC.mp4" }).click();
  await panel.getByRole("button", { name: "Retry poster and proxy" }).click();
  await expect(panel.getByRole("alert").filter({ hasText: "No poster or proxy" })).toHaveCount(0, { timeout: 60_000 });
  await expect(panel.getByText("Making poster and proxy…")).toHaveCount(0, { timeout: 60_000 });
  await expect.poll(async () => (await sql<{ media_state: string; media_attempts: number }>("select media_state, media_attempts from clips where id = $1", [clip!.id]))[0]).toEqual({ media_state: "ready", media_attempts: 2 });
  // The player plays the proxy, which this browser decodes: its picture has a size.
  const video = panel.locator("video");
  await expect.poll(() => video.evaluate((v: HTMLVideoElement) => v.videoWidth), { timeout: 30_000 }).toBe(320);
  await expect(panel.getByText("The file says 25 fps")).toHaveCount(0);
  await snap(page, "media-03-ready-desk");
});
