import path from "node:path";
import { expect, test } from "@playwright/test";
import { frameAtSeconds, sourceLabel } from "../../shared/timecode/playhead";
import { frameRates } from "../../shared/timecode/rates";
import { expectNoSeriousA11yViolations } from "./axe";
import { hostWithEpisode, member, signInOn, snap, sql } from "./support";

// D003_C007.mov: 90 frames of 192×108 H.264 at 30000/1001 fps, QuickTime timecode track starting at
// 01:00:59;18, each frame carrying its own drop-frame label burned in, so a screenshot shows which
// frame is on screen. Made with Debian's ffmpeg 5.1:
//   ffmpeg -f lavfi -i color=c=0x2b2b2b:s=192x108:r=30000/1001 -frames:v 90 \
//     -vf "drawtext=fontfile=DejaVuSansMono-Bold.ttf:timecode='01\:00\:59\;18':rate=30000/1001:fontsize=18:fontcolor=white:x=(w-tw)/2:y=(h-th)/2" \
//     -c:v libx264 -profile:v baseline -pix_fmt yuv420p -crf 30 -g 30 -timecode "01:00:59;18" -movflags +faststart D003_C007.mov
const clipFile = path.resolve(import.meta.dirname, "../fixtures/rushes/D003_C007.mov");
const ntsc = frameRates["29.97"];
const df = { rate: ntsc, dropFrame: true };

test("an editor marks in and out from the picture by keyboard on a 29.97 drop-frame clip", async ({ page, browser }) => {
  test.setTimeout(120_000);
  const hostContext = await browser.newContext();
  const { channelId, episodeId } = await hostWithEpisode(await hostContext.newPage(), {
    host: { name: "Maren Solberg", channel: "Tidewater Workshop" },
    episode: { title: "Hull test tank", question: "Does a chined hull plane sooner?", origin: "idea", stage: "edit" },
  });
  await hostContext.close();
  const editor = await member(channelId, "Sindre Holm", "editor");
  await signInOn(page, editor.email);
  await page.goto(`/c/${channelId}/episodes/${episodeId}/footage`);
  await page.getByLabel("Camera files").setInputFiles(clipFile);
  await expect(page.getByRole("listitem", { name: "Upload of D003_C007.mov" }).getByText(/^Stored/)).toBeVisible({ timeout: 30_000 });
  await page.getByRole("table").getByRole("button", { name: "D003_C007.mov" }).click();

  const panel = page.getByRole("dialog");
  const player = panel.getByRole("group", { name: "Player" });
  const shown = player.getByRole("status", { name: "Playhead timecode" });
  await expect(shown).toHaveText("01:00:59;18");
  // Once the picture has data, the first frame replaces the poster (taken from further in).
  await expect.poll(() => player.locator("video").evaluate((v: HTMLVideoElement) => v.readyState)).toBeGreaterThanOrEqual(2);
  await player.screenshot({ path: path.resolve(import.meta.dirname, "../../.kerf/test-output/screenshots/player-00-first-frame.png") });
  // The keys are on the player's buttons, and in the sheet "?" opens; Escape closes only the sheet.
  await expect(player.getByRole("button", { name: "In here" })).toHaveAttribute("aria-keyshortcuts", "I");
  await player.focus();
  await page.keyboard.press("?");
  const sheet = page.getByRole("dialog", { name: "Player keys" });
  await expect(sheet.getByRole("row", { name: /O Out at this frame/ })).toBeVisible();
  await snap(page, "player-01-keys");
  await page.keyboard.press("Escape");
  await expect(sheet).toBeHidden();
  await expect(player).toBeVisible();

  // Five frames on, in; then across the minute, where drop-frame skips ;00 and ;01.
  await player.focus();
  for (let i = 0; i < 5; i++) await page.keyboard.press("ArrowRight");
  await expect(shown).toHaveText("01:00:59;23");
  await page.keyboard.press("i");
  const inShown = await shown.textContent();
  await page.keyboard.press("Shift+ArrowRight");
  await expect(shown).toHaveText("01:01:00;25");
  await page.keyboard.press("ArrowLeft");
  await expect(shown).toHaveText("01:01:00;24");
  await page.keyboard.press("o");
  const outShown = await shown.textContent();
  await expect(player).toContainText(`In ${inShown} · Out ${outShown}`);
  await snap(page, "player-02-in-and-out");
  await panel.screenshot({ path: path.resolve(import.meta.dirname, "../../.kerf/test-output/screenshots/player-02-panel.png") });

  // N writes the note, Enter saves it; the keys are back on the player for the next mark.
  await page.keyboard.press("n");
  // Letters typed before the note has the focus are the player's keys ("i" sets in): wait for it.
  await expect(panel.getByRole("textbox", { name: "Note", exact: true })).toBeFocused();
  await page.keyboard.type("chine catches spray");
  await page.keyboard.press("Enter");
  const saved = panel.getByRole("list", { name: "Marks on this clip" });
  await expect(saved).toContainText(`${inShown} → ${outShown}`);
  await expect(saved).toContainText("chine catches spray");
  await expect(player).toBeFocused();
  const [row] = await sql<{ in_label: string; out_label: string }>("select in_label, out_label from clip_marks m join clips c on c.id = m.clip_id where c.file_name = $1 and c.channel_id = $2", ["D003_C007.mov", channelId]);
  expect(row).toEqual({ in_label: "01:00:59;23", out_label: "01:01:00;24" });

  // Play and stop: the playhead parks on a whole frame and names the one the picture is on.
  await page.keyboard.press("Home");
  await expect(shown).toHaveText("01:00:59;18");
  await page.keyboard.press(" ");
  await expect(player.getByRole("button", { name: "Stop" })).toBeVisible();
  await page.keyboard.press(" ");
  await expect(player.getByRole("button", { name: "Play" })).toBeVisible();
  const video = player.locator("video");
  await expect
    .poll(async () => (await shown.textContent()) === sourceLabel("01:00:59;18", frameAtSeconds(await video.evaluate((v: HTMLVideoElement) => v.currentTime), ntsc), df) && (await video.evaluate((v: HTMLVideoElement) => !v.seeking)))
    .toBe(true);

  // Away and back by the strip under the picture.
  await page.keyboard.press("End");
  await expect(shown).toHaveText("01:01:02;19");
  await player.getByRole("button", { name: "Go to mark 01:00:59;23 → 01:01:00;24, chine catches spray" }).click();
  await expect(shown).toHaveText("01:00:59;23");
  await snap(page, "player-03-strip");
  await expectNoSeriousA11yViolations(page, "the clip player");

  // Typed timecode is still there, beside the picture.
  const typed = panel.getByRole("form", { name: "Add a mark" });
  await typed.getByLabel("In", { exact: true }).fill("01:01:01;00");
  await typed.getByLabel("Out", { exact: true }).fill("01:01:02;00");
  await typed.getByRole("button", { name: "Add mark" }).click();
  await expect(saved).toContainText("01:01:01;00 → 01:01:02;00");

  // On a phone the panel and the player fit the width.
  await page.setViewportSize({ width: 390, height: 844 });
  await expect(shown).toBeVisible();
  expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
  expect(await panel.evaluate((el) => el.scrollWidth - el.clientWidth)).toBeLessThanOrEqual(0);
  await snap(page, "player-04-phone");
  await panel.screenshot({ path: path.resolve(import.meta.dirname, "../../.kerf/test-output/screenshots/player-04-panel.png") });
});
