import path from "node:path";
import { expect, test, type Page } from "@playwright/test";
import { addDays } from "../../shared/calendar/days";
import { formatDay } from "../../shared/fields/written-dates";
import { expectNoSeriousA11yViolations } from "./axe";
import { DESK, PHONE, dealWithReviewLink, expectFitsPhone, hostWithEpisode, snap, sql } from "./support";

// The 90-frame 29.97 drop-frame fixture of rushes-player.spec.ts (the ffmpeg command that made it is written there).
const clipFile = path.resolve(import.meta.dirname, "../fixtures/rushes/D003_C007.mov");
const todayUtc = () => new Date().toISOString().slice(0, 10);

/** The month view's cell of a day, stepping to the next month when the day is past the grid. */
async function dayCell(page: Page, day: string) {
  const cell = page.locator(`li[data-day="${day}"]`);
  await expect(page.getByRole("list", { name: "Days of the month" })).toBeVisible();
  if ((await cell.count()) === 0) await page.getByRole("button", { name: "Later" }).click();
  await expect(cell).toBeVisible();
  return cell;
}

/**
 * A drag with the pointer, in small steps, as dnd-kit's pointer sensor needs to see it move. The button
 * is let go once the calendar has announced the entry over the target day: dnd-kit works out what is under the
 * pointer in a render that can come after the last move on a busy machine.
 */
async function dragTo(page: Page, from: { x: number; y: number; width: number; height: number }, to: { x: number; y: number; width: number; height: number }, day: string) {
  await page.mouse.move(from.x + from.width / 2, from.y + from.height / 2);
  await page.mouse.down();
  await page.mouse.move(from.x + from.width / 2 + 10, from.y + from.height / 2, { steps: 3 });
  await page.mouse.move(to.x + to.width / 2, to.y + 12, { steps: 12 });
  await expect(page.getByText(new RegExp(` is over ${formatDay(day)}\\.$`))).toBeAttached();
  await page.mouse.up();
}

test("the calendar's month shows a publish day, a move shows what goes with it before saving, and search lands on a mark", async ({ page }) => {
  test.setTimeout(240_000);
  await page.setViewportSize(DESK);
  const publish = addDays(todayUtc(), 6);
  const { channelId, episodeId, csrfToken } = await hostWithEpisode(page, {
    host: { name: "Runa Akerfeldt", channel: "Offcut Bench" },
    episode: { title: "Bandsaw fence drift", question: "Does a tall fence stop drift?", origin: "sponsor", stage: "shoot", targetPublishDate: publish },
  });
  await dealWithReviewLink(page, channelId, episodeId, csrfToken);

  // The month, with the publish day and its stage due dates; the entry links to the episode's overview.
  await page.goto(`/c/${channelId}/calendar`);
  await expect(page.getByRole("heading", { name: "Calendar" })).toBeVisible();
  const from = await dayCell(page, publish);
  const chip = from.locator('[data-kind="publish"]');
  await expect(chip.getByRole("link", { name: "Publish: Bandsaw fence drift" })).toHaveAttribute("href", `/c/${channelId}/episodes/${episodeId}/overview`);
  await snap(page, "calendar-01-month");
  await expectNoSeriousA11yViolations(page, "calendar month");

  // Dragged a day earlier: the panel lists what moves with it, and nothing is saved yet.
  const target = addDays(publish, -1);
  const to = await dayCell(page, target);
  await dragTo(page, (await chip.getByRole("button", { name: /^Drag to move/ }).boundingBox())!, (await to.boundingBox())!, target);
  const panel = page.getByRole("dialog", { name: "Move the publish day of “Bandsaw fence drift”" });
  const moves = panel.getByRole("list", { name: "What moves with it" });
  await expect(moves.getByRole("listitem").filter({ hasText: "Sponsor approves the script" })).toContainText(`${formatDay(addDays(publish, -14))} → ${formatDay(addDays(publish, -15))}`);
  await expect(moves.getByRole("listitem").filter({ hasText: "Publish: Bandsaw fence drift" })).toContainText(`${formatDay(publish)} → ${formatDay(target)}`);
  expect((await sql<{ d: string }>("select target_publish_date::text as d from episodes where id = $1", [episodeId]))[0]!.d).toBe(publish);
  await snap(page, "calendar-02-what-moves");
  await expectNoSeriousA11yViolations(page, "what moves with a publish day");
  await panel.getByRole("button", { name: `Move to ${formatDay(target)}` }).click();
  await expect(panel).toBeHidden();
  await expect(page.locator(`li[data-day="${target}"] [data-kind="publish"]`)).toBeVisible();
  await expect.poll(async () => (await sql<{ d: string }>("select target_publish_date::text as d from episodes where id = $1", [episodeId]))[0]!.d).toBe(target);

  // On a phone the calendar opens on the days ahead; the move is there from the keyboard too.
  await page.setViewportSize(PHONE);
  await page.goto(`/c/${channelId}/calendar`);
  await expect(page.getByRole("button", { name: "Days ahead" })).toHaveAttribute("aria-pressed", "true");
  const move = page.getByRole("button", { name: "Move publish day…" });
  await move.focus();
  await page.keyboard.press("Enter");
  await expect(panel).toBeVisible();
  await panel.getByLabel("New publish day").fill(addDays(target, 7));
  await panel.getByRole("button", { name: "Show what moves" }).press("Enter");
  await expect(moves.getByRole("listitem").filter({ hasText: "Sponsor approves the script" })).toBeVisible();
  await expectFitsPhone(page, "what moves, on a phone");
  await snap(page, "calendar-03-phone-move");
  await page.keyboard.press("Escape");
  await expect(panel).toBeHidden();
  await expectFitsPhone(page, "calendar on a phone");
  await snap(page, "calendar-04-phone");

  // Search from the keyboard: "/" reaches the finder, the mark's note finds the clip at its mark.
  await page.setViewportSize(DESK);
  await page.goto(`/c/${channelId}/episodes/${episodeId}/footage`);
  await page.getByLabel("Camera files").setInputFiles(clipFile);
  await expect(page.getByRole("listitem", { name: "Upload of D003_C007.mov" }).getByText(/^Stored/)).toBeVisible({ timeout: 60_000 });
  const [clip] = await sql<{ id: string }>("select id from clips where channel_id = $1 and file_name = $2", [channelId, "D003_C007.mov"]);
  const marked = await page.request.post(`/api/channels/${channelId}/clips/${clip!.id}/marks`, {
    headers: { "x-csrf-token": csrfToken },
    data: { in: "01:01:00;20", out: "01:01:01;10", note: "Blade wanders off the fence" },
  });
  expect(marked.status(), await marked.text()).toBe(201);
  await page.goto(`/c/${channelId}/calendar`);
  await expect(page.getByRole("heading", { name: "Calendar" })).toBeVisible();
  await page.keyboard.press("/");
  const box = page.getByRole("searchbox", { name: "Find in this channel" });
  await expect(box).toBeFocused();
  await page.keyboard.type("wanders");
  const marks = page.getByRole("search").getByRole("region", { name: "Marks on clips" });
  const markLink = marks.getByRole("link");
  await expect(markLink).toHaveCount(1);
  for (let i = 0; i < 10 && !(await markLink.evaluate((a) => a === document.activeElement)); i++) await page.keyboard.press("ArrowDown");
  await expect(markLink).toBeFocused();
  await page.keyboard.press("Enter");
  await expect(page).toHaveURL(new RegExp(`/c/${channelId}/rushes\\?clip=${clip!.id}&mark=`));
  // The clip opens with its mark as the current one (the player's seek to it is search.spec.ts's to check).
  await expect(page.getByRole("dialog").getByRole("list", { name: "Marks on this clip" }).getByRole("listitem").filter({ hasText: "Blade wanders off the fence" })).toHaveAttribute("aria-current", "true");
  await snap(page, "calendar-05-search-at-mark");
});
