import { expect, test, type Page } from "@playwright/test";
import type { Role } from "../../shared/access/roles";
import { expectNoSeriousA11yViolations } from "./axe";
import { demoChannelId, expectHome, signInToDemo, snap } from "./support";

/*
 * Each member of the demo channel signs in and lands on their home, sees what needs them, and one
 * entry's link opens the place where it is done.
 */
let channelId: string;

test.beforeAll(async () => {
  channelId = await demoChannelId();
});

const signInAs = (page: Page, role: Role) => signInToDemo(page, role, channelId);

const group = (page: Page, name: string) => page.getByRole("region", { name: new RegExp(`^${name}`) });

/** At phone size the page never scrolls sideways; the screenshot of both sizes is kept. */
async function checkSizes(page: Page, role: Role) {
  await expectNoSeriousA11yViolations(page, `${role}'s home`);
  await snap(page, `home-${role}-desk`);
  await page.setViewportSize({ width: 390, height: 844 });
  await expectHome(page);
  expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(await page.evaluate(() => document.documentElement.clientWidth));
  await snap(page, `home-${role}-phone`);
  await expectNoSeriousA11yViolations(page, `${role}'s home on a phone`);
  await page.setViewportSize({ width: 1280, height: 800 });
}

test.use({ viewport: { width: 1280, height: 800 } });
// Two pages and four axe runs a test, on a shared machine.
test.describe.configure({ timeout: 150_000 });

test("the host lands on episodes running late and essentials missing, and an entry opens the episode", async ({ page }) => {
  await signInAs(page, "owner");
  await expect(group(page, "Episodes running late").getByRole("link", { name: /Two-stage bottle rocket/ })).toBeVisible();
  await expect(group(page, "Essentials missing before the next stage").getByRole("link", { name: /Cheap and dear soldering irons, measured: before Publish/ })).toBeVisible();
  await checkSizes(page, "owner");
  await group(page, "Episodes running late").getByRole("link", { name: /Two-stage bottle rocket/ }).click();
  await expect(page.getByRole("heading", { level: 1, name: "Two-stage bottle rocket" })).toBeVisible();
  await expect(page).toHaveURL(/\/overview$/);
});

test("the producer lands on sponsor items to chase, and an entry opens the desk on that episode", async ({ page }) => {
  await signInAs(page, "producer");
  const items = group(page, "Sponsor items to chase");
  await expect(items.getByText(/was sent and waits on the sponsor/)).toBeVisible();
  await expect(items.getByText(/came back: changes were asked/)).toBeVisible();
  await checkSizes(page, "producer");
  await items.getByRole("link", { name: /Copperleaf Tools: Sponsor's final approval/ }).click();
  await expect(page.getByRole("heading", { name: "Desk" })).toBeVisible();
  await expect(page.getByLabel("Episode")).not.toHaveValue("");
});

test("the editor lands on segment cuts due and clips not rated, and a clip's entry opens it for logging", async ({ page }) => {
  await signInAs(page, "editor");
  await expect(group(page, "Segment cuts due").getByRole("link", { name: /Draft cut of the segment/ }).first()).toBeVisible();
  await expect(page.getByRole("main").getByText(/invoice|payment/i)).toHaveCount(0);
  await checkSizes(page, "editor");
  await group(page, "Clips not logged yet").getByRole("link", { name: /BCAM_C007\.MOV/ }).click();
  await expect(page.getByRole("dialog").getByRole("heading", { name: "BCAM_C007.MOV" })).toBeVisible();
  await expect(page.getByRole("form", { name: "Log this clip" })).toBeVisible();
});

test("crew land on today's shoot day, its shots and the hazards to check, and check one at power-on", async ({ page }) => {
  await signInAs(page, "crew");
  await expect(group(page, "Shoot day").getByRole("link", { name: /Today: Thermal camera on a kite/ })).toBeVisible();
  await expect(group(page, "Shots still to get").getByRole("listitem")).toHaveCount(5);
  // The top bar offers the sponsors' pages crew may read; the home itself says nothing of them.
  await expect(page.getByRole("main").getByText(/sponsor|fee|invoice/i)).toHaveCount(0);
  await checkSizes(page, "crew");

  await group(page, "Hazards to check before power-on").getByRole("link", { name: /Over-voltage on motors and fans/ }).click();
  const hazard = page.getByRole("listitem", { name: "Over-voltage on motors and fans" });
  await hazard.getByRole("button", { name: "Mark as checked by me" }).click();
  // The check is saved, then the sheet read again; on a loaded machine that can take a while.
  await expect(hazard.getByText(/Checked by Kwame Lindqvist/)).toBeVisible({ timeout: 30_000 });
  // Crew check, but the hazard list and its precautions stay the plan's writers'.
  await expect(hazard.getByRole("button", { name: "Edit mitigation" })).toHaveCount(0);
  await page.getByRole("navigation", { name: "Channel pages" }).getByRole("link", { name: "Home" }).click();
  await expect(group(page, "Hazards to check before power-on").getByRole("link", { name: /Over-voltage/ })).toHaveCount(0);

  // Put it back, so the demo reads the same on the next run.
  await page.goBack();
  await page.getByRole("listitem", { name: "Over-voltage on motors and fans" }).getByRole("button", { name: "Undo the check" }).click();
  await expect(page.getByRole("listitem", { name: "Over-voltage on motors and fans" }).getByText("Not checked yet")).toBeVisible({ timeout: 30_000 });

  await page.getByRole("navigation", { name: "Channel pages" }).getByRole("link", { name: "Home" }).click();
  await group(page, "Shoot day").getByRole("link", { name: /Today: Thermal camera on a kite/ }).click();
  await expect(page.getByRole("heading", { level: 1, name: /^Shoot day/ })).toBeVisible();
});
