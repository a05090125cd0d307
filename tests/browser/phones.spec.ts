import { expect as baseExpect, test, type Page } from "@playwright/test";
import { expectNoSeriousA11yViolations } from "./axe";
import { dealWithReviewLink, DESK, expectFitsPhone, hostWithEpisode, member, PHONE, signInOn, snap, sql } from "./support";

test.use({ viewport: PHONE });
// Each page is a first visit (its code fetched, its data loaded) on a machine shared with other runs.
const expect = baseExpect.configure({ timeout: 30_000 });
test.setTimeout(300_000);

/** The page as it stands fits a phone and passes axe; a screenshot at phone size and one at desk size are kept. */
async function fits(page: Page, name: string): Promise<void> {
  await expectFitsPhone(page, name);
  await snap(page, `phone-${name}`);
  await expectNoSeriousA11yViolations(page, `${name} on a phone`);
  await page.setViewportSize(DESK);
  await snap(page, `desk-${name}`);
  await page.setViewportSize(PHONE);
}

const host = (page: Page) =>
  hostWithEpisode(page, {
    host: { name: "Hallvard Brekke", channel: "Quarry Lane Machines" },
    episode: { title: "Wind tunnel from a box fan", question: "Does a honeycomb straightener smooth the flow enough to read lift?", origin: "sponsor", stage: "build", targetPublishDate: "2027-06-14" },
  });

test("signed out: sign-in, sign-up and a forgotten password fit a phone", async ({ page }) => {
  await page.goto("/sign-in");
  await expect(page.getByRole("heading", { name: "Sign in" })).toBeVisible();
  await fits(page, "sign-in");
  await page.goto("/sign-up");
  await expect(page.getByRole("button", { name: "Create account and channel" })).toBeVisible();
  await fits(page, "sign-up");
  await page.goto("/forgot-password");
  await expect(page.getByRole("button").first()).toBeVisible();
  await fits(page, "forgot-password");
});

test("a host on a phone opens the menu, reads the slate one stage at a time, and the shelf and desk fit", async ({ page }) => {
  const { channelId, episodeId, csrfToken } = await host(page);
  await dealWithReviewLink(page, channelId, episodeId, csrfToken);

  // The header is one short bar; its pages are behind the menu button.
  await page.goto(`/c/${channelId}/slate`);
  const menu = page.getByRole("button", { name: "Menu" });
  await expect(menu).toHaveAttribute("aria-expanded", "false");
  await expect(page.getByRole("navigation", { name: "Channel pages" })).toBeHidden();
  expect((await page.locator("body > div header").first().boundingBox())!.height).toBeLessThan(70);

  // The slate shows the stage with the episode; the switcher moves between stages by keyboard.
  const switcher = page.getByRole("group", { name: "Stage shown" });
  await expect(switcher.getByRole("status")).toHaveText("Build, stage 3 of 7: 1 episode");
  await expect(page.getByRole("link", { name: "Wind tunnel from a box fan" })).toBeVisible();
  await expect(page.getByRole("region", { name: /Challenge/ })).toBeHidden();
  await fits(page, "slate");
  await switcher.getByRole("button", { name: "Previous stage" }).focus();
  await page.keyboard.press("Enter");
  await expect(switcher.getByRole("status")).toHaveText("Test plan, stage 2 of 7: no episodes");
  await expect(page.getByRole("link", { name: "Wind tunnel from a box fan" })).toBeHidden();
  await switcher.getByLabel("Stage", { exact: true }).selectOption({ label: "7 Publish (0)" });
  await expect(switcher.getByRole("status")).toHaveText("Publish, stage 7 of 7: no episodes");

  // A dialog is the whole screen on a phone.
  await page.getByRole("button", { name: "New episode" }).click();
  const dialog = page.getByRole("dialog", { name: "New episode" });
  await expect(dialog).toBeVisible();
  const box = (await dialog.boundingBox())!;
  expect([box.x, box.width]).toEqual([0, PHONE.width]);
  await expectFitsPhone(page, "new episode");
  await snap(page, "phone-slate-new-episode");
  await page.keyboard.press("Escape");

  await menu.click();
  await expect(menu).toHaveAttribute("aria-expanded", "true");
  await fits(page, "menu-open");
  await page.keyboard.press("Escape");
  await expect(menu).toHaveAttribute("aria-expanded", "false");
  await expect(menu).toBeFocused();
  await visitFromMenu(page, "Shelf");
  await visitFromMenu(page, "Desk");
  await expect(page.getByText("Sponsor approves the script").first()).toBeVisible();
  await fits(page, "desk");
});

/** Follows a page's link in the phone's menu, which shuts as the page opens. */
async function visitFromMenu(page: Page, label: string): Promise<void> {
  const menu = page.getByRole("button", { name: "Menu" });
  await menu.click();
  await page.getByRole("navigation", { name: "Channel pages" }).getByRole("link", { name: label }).click();
  await expect(page.getByRole("heading", { level: 1, name: label })).toBeVisible();
  await expect(menu).toHaveAttribute("aria-expanded", "false");
  if (label !== "Desk") await fits(page, label.toLowerCase());
}

test("on a phone the sponsors, members and account pages fit, and so does the sponsor's review page", async ({ page, browser }) => {
  const { channelId, episodeId, csrfToken } = await host(page);
  const reviewUrl = await dealWithReviewLink(page, channelId, episodeId, csrfToken);
  await page.goto(`/c/${channelId}/slate`);
  await visitFromMenu(page, "Sponsors");
  await visitFromMenu(page, "Members");
  await page.getByRole("button", { name: "Menu" }).click();
  await page.getByRole("link", { name: /Your account/ }).click();
  await expect(page.getByRole("heading", { level: 1, name: "Your account" })).toBeVisible();
  await fits(page, "account");

  // The sponsor's contact reads the review page on their phone, signed out.
  const sponsorContext = await browser.newContext({ viewport: PHONE });
  const sponsor = await sponsorContext.newPage();
  await sponsor.goto(reviewUrl);
  await expect(sponsor.getByRole("heading", { name: "Review: Sponsor approves the script" })).toBeVisible();
  await fits(sponsor, "review");
  await sponsorContext.close();
});

test("an editor on a phone filters the rushes and opens a clip as a full-screen sheet", async ({ page, browser }) => {
  const hostContext = await browser.newContext();
  const { channelId, episodeId } = await hostWithEpisode(await hostContext.newPage(), {
    host: { name: "Turid Lien", channel: "Millrace Fabrication" },
    episode: { title: "Spot welder from a microwave transformer", question: "Does a 2-turn secondary weld 0.2 mm nickel strip?", origin: "idea", stage: "shoot" },
  });
  await hostContext.close();
  await sql(
    `insert into clips (channel_id, episode_id, object_key, file_name, content_type, size_bytes, duration_ms, frame_rate_numerator, frame_rate_denominator, drop_frame, start_timecode, recorded_at)
     values ($1, $2, $3, 'A001_C014_WELD_CLOSEUP.mov', 'video/quicktime', 48000000, 12040, 25, 1, false, '10:04:12:00', now())`,
    [channelId, episodeId, `${channelId}/${episodeId}/A001_C014_WELD_CLOSEUP.mov`],
  );
  const editor = await member(channelId, "Eirik Vang", "editor");
  await signInOn(page, editor.email);
  await page.goto(`/c/${channelId}/rushes`);
  const clip = page.getByRole("button", { name: "A001_C014_WELD_CLOSEUP.mov" });
  await expect(clip).toBeVisible();
  // The filters fold under one button on a phone, so the clips come first.
  const filters = page.getByRole("form", { name: "Filter footage" });
  await expect(filters).toBeHidden();
  await page.getByRole("button", { name: "Filters" }).click();
  await expect(filters.getByRole("button", { name: "Apply filters" })).toBeVisible();
  await fits(page, "rushes");

  await clip.click();
  const panel = page.getByRole("dialog");
  await expect(panel.getByRole("heading", { name: "A001_C014_WELD_CLOSEUP.mov" })).toBeVisible();
  const box = (await panel.boundingBox())!;
  expect([box.x, box.width]).toEqual([0, PHONE.width]);
  await expect(panel.getByRole("button", { name: "Close" })).toBeInViewport();
  await fits(page, "rushes-clip");
  await panel.getByRole("button", { name: "Close" }).click();
  await expect(panel).toBeHidden();

  // The episode's shoot plan and upload are the crew's on set: "Add a shot" and the upload hint fit too.
  await page.goto(`/c/${channelId}/episodes/${episodeId}/shoot`);
  await expect(page.getByRole("button", { name: "Add a shot" })).toBeVisible();
  await expectFitsPhone(page, "episode's shoot days and shots");
  await snap(page, "phone-episode-shoot");
  await page.goto(`/c/${channelId}/episodes/${episodeId}/footage`);
  await expect(page.getByRole("heading", { level: 2, name: "Footage" })).toBeVisible();
  await expectFitsPhone(page, "episode's footage");
});
