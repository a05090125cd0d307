import { expect, test } from "@playwright/test";
import { expectNoSeriousA11yViolations } from "./axe";
import { hostWithEpisode, snap } from "./support";

// The browser stands in Berlin: a new account starts in the browser's zone.
test.use({ timezoneId: "Europe/Berlin" });
test.setTimeout(180_000);

test("a signed deal is recorded against its sponsor, waits for a publish date, and is tied to its episode later", async ({ page }) => {
  const { channelId, episodeId } = await hostWithEpisode(page, {
    host: { name: "Maren Tollef", channel: "Kettle Hill Makers" },
    episode: { title: "Coil winder from scrap", question: "Can a drill wind an even coil?", origin: "sponsor", stage: "sponsor_read", targetPublishDate: "2027-03-02" },
  });
  const me = await (await page.request.get("/api/auth/me")).json();
  expect(me.user.timeZone).toBe("Europe/Berlin");

  await page.goto(`/c/${channelId}/sponsors`);
  const addSponsor = page.getByRole("form", { name: "Add a sponsor" });
  await addSponsor.getByLabel("Company").fill("Veldt Copper Works");
  await addSponsor.getByRole("button", { name: "Add sponsor" }).click();
  const sponsor = page.getByRole("article", { name: "Veldt Copper Works" });
  await expect(sponsor.getByText("None. A deal signed before its episode")).toBeVisible();

  // Recorded from the sponsor, with the channel's starting template: no episode, so no dates yet.
  await sponsor.getByRole("button", { name: "Record a signed deal" }).click();
  const dealForm = page.getByRole("form", { name: "New deal" });
  await expect(dealForm.getByLabel("Sponsor", { exact: true }).locator("option:checked")).toHaveText("Veldt Copper Works");
  await dealForm.getByLabel("Deliverables from template").selectOption({ index: 1 });
  await dealForm.getByLabel("Fee").fill("1,800.50");
  await dealForm.getByRole("button", { name: "Create deal" }).click();
  const waiting = sponsor.getByRole("listitem", { name: /Deal waiting for an episode/ });
  await expect(waiting).toContainText("its items are waiting for a publish date");
  await expect(waiting).toContainText("€1,800.50");
  await snap(page, "sponsors-waiting-01-recorded");
  await expectNoSeriousA11yViolations(page, "sponsor with a deal waiting for its episode");

  // On a phone the waiting deal and its tie fit the width.
  await page.setViewportSize({ width: 390, height: 844 });
  await expect(waiting.getByRole("button", { name: "Tie to episode" })).toBeVisible();
  expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
  await snap(page, "sponsors-waiting-02-phone");
  await page.setViewportSize({ width: 1280, height: 800 });

  await waiting.getByRole("button", { name: "Tie to episode" }).click();
  await expect(waiting.getByText("Pick the episode this deal is for.")).toBeVisible();
  await waiting.getByLabel("Episode").selectOption({ label: "Coil winder from scrap (publishes Tue 2 Mar 2027)" });
  await waiting.getByRole("button", { name: "Tie to episode" }).click();
  const onEpisode = sponsor.getByRole("link", { name: "Coil winder from scrap" });
  await expect(onEpisode).toBeVisible();
  await expect(sponsor.getByText("None. A deal signed before its episode")).toBeVisible();
  await snap(page, "sponsors-waiting-03-tied");

  // Tied: the items now count from the episode's publish date.
  await onEpisode.click();
  await expect(page).toHaveURL(new RegExp(`/episodes/${episodeId}`));
  const deal = page.getByRole("article", { name: "Deal with Veldt Copper Works" });
  await expect(deal.getByRole("row", { name: /^Video goes live Go-live Tue 2 Mar 2027 / })).toBeVisible();
  await expect(deal.getByRole("row", { name: /^Draft cut of the segment to the sponsor .*Tue 23 Feb 2027 7 days before publish/ })).toBeVisible(); // 2 Mar − 7 days
  await snap(page, "sponsors-waiting-04-dated");
});
