import path from "node:path";
import { expect, test, type Locator, type Page } from "@playwright/test";
import { expectNoSeriousA11yViolations } from "./axe";
import { dealWithReviewLink, hostWithEpisode } from "./support";

const TITLE = "Gantry crane from extrusion offcuts";
const fixtures = path.resolve(import.meta.dirname, "../fixtures/rushes");

/** Collects what the page's content security policy refused; helmet's policy logs each refusal. */
function watchCsp(page: Page): string[] {
  const violations: string[] = [];
  page.on("console", (message) => {
    if (/Content Security Policy/i.test(message.text())) violations.push(message.text());
  });
  return violations;
}

const host = (page: Page) =>
  hostWithEpisode(page, {
    host: { name: "Tomas Rehnquist", channel: "Offcut Yard Engineering" },
    episode: { title: TITLE, question: "Does a 2 m gantry of offcuts lift 50 kg without sagging 2 mm?", origin: "sponsor", stage: "challenge", targetPublishDate: "2027-05-10" },
  });

/** Presses Tab until the target has the focus, at most `limit` times. */
async function tabUntilFocused(page: Page, target: Locator, limit: number): Promise<void> {
  for (let presses = 0; presses < limit; presses++) {
    if (await target.evaluate((element) => element === document.activeElement)) return;
    await page.keyboard.press("Tab");
  }
  await expect(target).toBeFocused();
}

test.setTimeout(120_000);

test("the slate, an episode, its test plan, the desk and a sponsor's review link pass axe-core and the content security policy", async ({ page, browser }) => {
  const csp = watchCsp(page);
  const { channelId, episodeId, csrfToken } = await host(page);
  const reviewUrl = await dealWithReviewLink(page, channelId, episodeId, csrfToken);

  await page.goto(`/c/${channelId}/slate`);
  await expect(page.getByRole("link", { name: TITLE })).toBeVisible();
  await expectNoSeriousA11yViolations(page, "slate");

  await page.getByRole("link", { name: TITLE }).click();
  await expect(page.getByRole("heading", { name: TITLE })).toBeVisible();
  await expectNoSeriousA11yViolations(page, "episode");
  const parts = page.getByRole("navigation", { name: "Parts of the episode" });
  await parts.getByRole("link", { name: "Sponsor deals" }).click();
  await expect(page.locator("#sponsor-deals").getByRole("heading", { name: "Tarnvik Linear Rail" })).toBeVisible();
  await expectNoSeriousA11yViolations(page, "episode's sponsor deals");
  await parts.getByRole("link", { name: "Test plan" }).click();
  await expect(page.getByRole("form", { name: "Test plan" })).toBeVisible();

  // The test plan sheet with something on it: the plan, one criterion and one hazard.
  const plan = page.getByRole("form", { name: "Test plan" });
  await plan.getByLabel("Hypothesis").fill("Two offcut rails braced every 400 mm sag less than 2 mm under 50 kg.");
  await plan.getByLabel("Method").fill("Hang the load mid-span, read the dial gauge after a minute.");
  await plan.getByRole("button", { name: "Save the test plan" }).click();
  await expect(page.getByText("Test plan saved.")).toBeVisible();
  await page.getByRole("button", { name: "Add a criterion" }).click();
  const criterion = page.getByRole("form", { name: "New criterion" });
  await criterion.getByLabel("Metric").selectOption("thrust_to_weight");
  await criterion.getByLabel("Threshold", { exact: true }).fill("1");
  await criterion.getByLabel("Unit of threshold").fill("1");
  await criterion.getByRole("button", { name: "Add criterion" }).click();
  await expect(page.getByText("Thrust-to-weight ≥ 1", { exact: true })).toBeVisible();
  await page.getByRole("button", { name: "Add a hazard" }).click();
  const hazard = page.getByRole("form", { name: "New hazard" });
  await hazard.getByLabel("Hazard").selectOption("spinning_blades");
  await hazard.getByRole("button", { name: "Add hazard" }).click();
  await expect(page.getByRole("listitem", { name: "Spinning blades and propellers" })).toBeVisible();
  await expectNoSeriousA11yViolations(page, "test plan");

  await page.getByRole("link", { name: "Desk" }).click();
  await expect(page.getByRole("heading", { name: "Desk" })).toBeVisible();
  await expect(page.getByText("Sponsor approves the script").first()).toBeVisible();
  await expectNoSeriousA11yViolations(page, "producer's desk");

  // The sponsor's contact, signed out.
  const sponsorContext = await browser.newContext();
  const sponsor = await sponsorContext.newPage();
  const sponsorCsp = watchCsp(sponsor);
  await sponsor.goto(reviewUrl);
  await expect(sponsor.getByRole("heading", { name: "Review: Sponsor approves the script" })).toBeVisible();
  await expectNoSeriousA11yViolations(sponsor, "review link");
  await sponsorContext.close();

  expect(csp).toEqual([]);
  expect(sponsorCsp).toEqual([]);
});

test("camera files upload by keyboard alone, and the rushes list passes axe-core", async ({ page }) => {
  const csp = watchCsp(page);
  const { channelId, episodeId } = await host(page);
  await page.goto(`/c/${channelId}/episodes/${episodeId}`);
  await expect(page.getByRole("heading", { name: TITLE })).toBeVisible();
  const picker = page.getByLabel("Camera files");

  // By keyboard alone: Tab to the episode's parts, Enter on "Footage", then Tab on to the file control.
  const footagePart = page.getByRole("navigation", { name: "Parts of the episode" }).getByRole("link", { name: "Footage" });
  await tabUntilFocused(page, footagePart, 40);
  await page.keyboard.press("Enter");
  await expect(page).toHaveURL(/\/footage$/);
  await tabUntilFocused(page, picker, 40);
  await expect(picker).toBeFocused();

  const [chooser] = await Promise.all([page.waitForEvent("filechooser"), page.keyboard.press("Space")]);
  expect(chooser.isMultiple()).toBe(true);
  await chooser.setFiles(path.join(fixtures, "A001_C001.mov"));
  const upload = page.getByRole("listitem", { name: "Upload of A001_C001.mov" });
  await expect(upload.getByText(/^Stored/)).toBeVisible({ timeout: 30_000 });
  await expect(page.getByRole("progressbar", { name: "All files" })).toHaveAttribute("aria-valuenow", "100");

  // Enter opens it too; the focus stayed on the control.
  await expect(picker).toBeFocused();
  const [again] = await Promise.all([page.waitForEvent("filechooser"), page.keyboard.press("Enter")]);
  await again.setFiles([]);

  await page.getByRole("link", { name: "Rushes" }).click();
  await expect(page.getByRole("heading", { name: "Rushes" })).toBeVisible();
  await expect(page.getByRole("table").getByRole("row", { name: /A001_C001\.mov/ })).toBeVisible();
  await expectNoSeriousA11yViolations(page, "rushes");

  expect(csp).toEqual([]);
});
