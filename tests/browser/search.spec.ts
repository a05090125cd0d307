import path from "node:path";
import { expect, test } from "@playwright/test";
import { expectNoSeriousA11yViolations } from "./axe";
import { hostWithEpisode, snap, sql } from "./support";

// The 90-frame 29.97 drop-frame fixture of rushes-player.spec.ts (the ffmpeg command that made it is written there),
// starting at 01:00:59;18.
const clipFile = path.resolve(import.meta.dirname, "../fixtures/rushes/D003_C007.mov");

test("from the keyboard, a search lands on a clip at its mark", async ({ page }) => {
  test.setTimeout(150_000);
  await page.setViewportSize({ width: 1280, height: 800 });
  const { channelId, episodeId, csrfToken } = await hostWithEpisode(page, {
    host: { name: "Ilse Varga", channel: "Lathe & Loom" },
    episode: { title: "Ducted fan shoulder mount", question: "Does a duct add thrust at hover?", origin: "idea", stage: "shoot" },
  });
  await page.goto(`/c/${channelId}/episodes/${episodeId}/footage`);
  await page.getByLabel("Camera files").setInputFiles(clipFile);
  await expect(page.getByRole("listitem", { name: "Upload of D003_C007.mov" }).getByText(/^Stored/)).toBeVisible({ timeout: 30_000 });
  const [clip] = await sql<{ id: string }>("select id from clips where channel_id = $1 and file_name = $2", [channelId, "D003_C007.mov"]);
  const marked = await page.request.post(`/api/channels/${channelId}/clips/${clip!.id}/marks`, {
    headers: { "x-csrf-token": csrfToken },
    data: { in: "01:01:00;20", out: "01:01:01;10", note: "Prop wash lifts the tarp" },
  });
  expect(marked.status(), await marked.text()).toBe(201);

  await page.goto(`/c/${channelId}/slate`);
  const box = page.getByRole("searchbox", { name: "Find in this channel" });
  await expect(box).toBeVisible();
  // "/" from the page reaches the finder.
  await page.keyboard.press("/");
  await expect(box).toBeFocused();
  await page.keyboard.type("tarp");
  const finder = page.getByRole("search");
  await expect(finder.getByRole("status")).toHaveText(/results? for “tarp”/);
  const marks = finder.getByRole("region", { name: "Marks on clips" });
  await expect(marks.getByRole("link")).toHaveCount(1);
  await expect(marks.locator("mark")).toHaveText(["tarp"]);
  await snap(page, "search-01-results");
  await expectNoSeriousA11yViolations(page, "search results");

  // Down to the results, Enter opens the one under the focus.
  const markLink = marks.getByRole("link");
  for (let i = 0; i < 10 && !(await markLink.evaluate((a) => a === document.activeElement)); i++) await page.keyboard.press("ArrowDown");
  await expect(markLink).toBeFocused();
  await page.keyboard.press("Enter");

  await expect(page).toHaveURL(new RegExp(`/c/${channelId}/rushes\\?clip=${clip!.id}&mark=`));
  const panel = page.getByRole("dialog");
  await expect(panel.getByRole("status", { name: "Playhead timecode" })).toHaveText("01:01:00;20");
  await expect(panel.getByRole("list", { name: "Marks on this clip" }).getByRole("listitem").filter({ hasText: "Prop wash lifts the tarp" })).toHaveAttribute("aria-current", "true");
  await expect(finder.getByRole("status")).toBeHidden();
  await snap(page, "search-02-at-the-mark");

  // On a phone the finder is in the menu's sheet, and its results fit the screen.
  await page.setViewportSize({ width: 390, height: 844 });
  await page.goto(`/c/${channelId}/slate`);
  await page.getByRole("button", { name: "Menu" }).click();
  await box.fill("ducted shoulder");
  await expect(finder.getByRole("region", { name: "Episodes" }).getByRole("link")).toContainText("Ducted fan shoulder mount");
  // The finder and its results stay inside the screen (the board beside it scrolls on its own).
  for (const part of [box, finder.getByRole("status")]) {
    const at = (await part.boundingBox())!;
    expect(at.x).toBeGreaterThanOrEqual(0);
    expect(at.x + at.width).toBeLessThanOrEqual(390);
  }
  await snap(page, "search-03-phone");
});
