import { expect, test, type Page } from "@playwright/test";
import { stageLabels, type Stage } from "../../shared/slate/stages";
import { homeToSlate, PASSWORD, signUpThroughApi, snap, uniqueEmail } from "./support";

const TITLE = "Kite-lifted thermal camera";

const column = (page: Page, stage: string) => page.locator(`section[aria-labelledby='lane-${stage}']`);
const cardIn = (page: Page, stage: string) => column(page, stage).getByRole("link", { name: TITLE });

/** The owner's account and channel through the sign-up route (the page has its own journey, accounts.spec.ts), then the empty slate. */
async function signUp(page: Page, email: string) {
  const { channelId } = await signUpThroughApi(page, { name: "Tamsin Okafor", email, channel: "Marsh Lane Rigs" });
  await page.goto(`/c/${channelId}/slate`);
  await expect(page.getByRole("heading", { name: "Slate" })).toBeVisible();
}

/**
 * A mouse drag of the card onto another column, in small steps as a hand would. The button is let go
 * once the board has announced the card over the target column: the board works out what is under the
 * pointer in its own render, which can come after the last move when the machine is busy.
 */
async function dragByMouse(page: Page, from: Stage, to: Stage) {
  const card = await column(page, from).locator("li", { has: page.getByRole("link", { name: TITLE }) }).boundingBox();
  const target = await column(page, to).boundingBox();
  if (!card || !target) throw new Error("card or column not on screen");
  await page.mouse.move(card.x + card.width / 2, card.y + card.height / 2);
  await page.mouse.down();
  await page.mouse.move(card.x + card.width / 2 + 8, card.y + card.height / 2 + 8, { steps: 4 });
  await page.mouse.move(target.x + target.width / 2, target.y + 120, { steps: 20 });
  await expect(page.getByText(new RegExp(`${TITLE} is (in|at the end of) ${stageLabels[to]}`))).toBeAttached();
  await page.mouse.up();
}

/**
 * Space picks the card up from its handle, an arrow key takes it one column over, Space drops it.
 * Each key waits for the board's screen-reader announcement of the step before it, as a person
 * listening would. The sensor starts listening for arrows in a timer it sets at the pick-up, and
 * Chromium runs input before timers, so an arrow pressed right after the announcement can still be
 * lost. A timer set after the announcement runs after the sensor's, so waiting for one is waiting
 * for the sensor to listen.
 */
async function dragByKeyboard(page: Page, key: "ArrowRight" | "ArrowLeft", from: string, to: string) {
  const handle = page.getByRole("button", { name: `Move ${TITLE}` });
  await handle.focus();
  await page.keyboard.press("Space");
  await expect(handle).toHaveAttribute("aria-pressed", "true");
  await expect(page.getByText(new RegExp(`${TITLE} is in ${from}, position`))).toBeAttached();
  await page.evaluate(() => new Promise((resolve) => setTimeout(resolve)));
  await page.keyboard.press(key);
  await expect(page.getByText(new RegExp(`${TITLE} is (in|at the end of) ${to}`))).toBeAttached();
  await page.keyboard.press("Space");
  await expect(page.getByRole("status").filter({ hasText: `${TITLE} is now in ${to}.` })).toBeAttached();
}

/** Creating an episode opens its page; these journeys go on from the board. */
async function createAndReturnToSlate(page: Page) {
  await page.getByRole("button", { name: "Create episode" }).click();
  await expect(page.getByRole("heading", { name: TITLE })).toBeVisible();
  await expect(page.getByText(`“${TITLE}” is on the board, at the top of Challenge.`)).toBeVisible();
  await page.getByRole("link", { name: "← Slate" }).click();
  await expect(cardIn(page, "challenge")).toBeVisible();
}

test("the owner makes an episode and moves it along the board by mouse and by keyboard", async ({ page }) => {
  await signUp(page, uniqueEmail("slate-owner"));
  await page.getByRole("button", { name: "New episode" }).click();
  await page.getByRole("button", { name: "Create episode" }).click();
  await expect(page.getByText("Give the episode a working title.")).toBeVisible();
  await snap(page, "slate-01-new-episode-errors");

  await page.getByLabel("Working title").fill(TITLE);
  await page.getByLabel("The question, in one line").fill("Can a kite hold a camera steady enough to map roof heat loss?");
  await page.getByLabel("Target publish date").fill("2027-03-05");
  await createAndReturnToSlate(page);
  await snap(page, "slate-02-on-the-board");

  await dragByMouse(page, "challenge", "test_plan");
  await expect(cardIn(page, "test_plan")).toBeVisible();
  await expect(page.getByRole("status").filter({ hasText: `${TITLE} is now in Test plan.` })).toBeAttached();
  await snap(page, "slate-03-dragged-to-test-plan");
  await dragByMouse(page, "test_plan", "challenge");
  await expect(cardIn(page, "challenge")).toBeVisible();
  await expect(page.getByRole("status").filter({ hasText: `${TITLE} is now in Challenge.` })).toBeAttached();

  await dragByKeyboard(page, "ArrowRight", "Challenge", "Test plan");
  await expect(cardIn(page, "test_plan")).toBeVisible();
  await page.reload();
  await expect(cardIn(page, "test_plan")).toBeVisible();
  await snap(page, "slate-04-kept-after-reload");

  await dragByKeyboard(page, "ArrowLeft", "Test plan", "Challenge");
  await expect(cardIn(page, "challenge")).toBeVisible();
  await page.reload();
  await expect(cardIn(page, "challenge")).toBeVisible();

  // The history on the episode page has every stage move.
  await cardIn(page, "challenge").click();
  await expect(page.getByRole("heading", { name: TITLE })).toBeVisible();
  await page.getByRole("navigation", { name: "Parts of the episode" }).getByRole("link", { name: "History" }).click();
  await expect(page.locator("#history").getByText("moved it from Challenge to Test plan")).toHaveCount(2);
  await expect(page.locator("#history").getByText("moved it from Test plan to Challenge")).toHaveCount(2);
});

test("when two sessions move the same card, the second is told and sees the first one's move", async ({ page, browser }) => {
  const email = uniqueEmail("slate-two");
  await signUp(page, email);
  await page.getByRole("button", { name: "New episode" }).click();
  await page.getByLabel("Working title").fill(TITLE);
  await createAndReturnToSlate(page);

  const otherContext = await browser.newContext();
  const other = await otherContext.newPage();
  await other.goto("/sign-in");
  await other.getByLabel("E-mail").fill(email);
  await other.getByLabel("Password").fill(PASSWORD);
  await other.getByRole("button", { name: "Sign in" }).click();
  await homeToSlate(other);
  await expect(cardIn(other, "challenge")).toBeVisible();

  await dragByKeyboard(page, "ArrowRight", "Challenge", "Test plan");
  await expect(cardIn(page, "test_plan")).toBeVisible();

  // The second session still shows the card in challenge, at the version it loaded.
  await dragByMouse(other, "challenge", "test_plan");
  await expect(other.getByRole("alert")).toContainText("Someone else moved or changed");
  await expect(other.getByRole("alert")).toContainText("it is in Test plan now");
  await expect(cardIn(other, "test_plan")).toBeVisible();
  await expect(cardIn(other, "challenge")).toHaveCount(0);
  await snap(other, "slate-05-conflict-message");
  await otherContext.close();
});

test("when the publish date moves a week, the episode's due dates move with it", async ({ page }) => {
  await signUp(page, uniqueEmail("slate-dates"));
  await page.getByRole("button", { name: "New episode" }).click();
  await page.getByLabel("Working title").fill(TITLE);
  await page.getByLabel("Target publish date").fill("2027-03-05");
  // A new episode opens its own page.
  await page.getByRole("button", { name: "Create episode" }).click();
  await expect(page.getByRole("heading", { name: TITLE })).toBeVisible();

  // Check values derived by hand in shared/slate/schedule.test.ts (default lengths, Fri 5 Mar 2027).
  await expect(page.getByTestId("due-build")).toHaveText("Mon 15 Feb");
  await expect(page.getByTestId("due-edit")).toHaveText("Mon 1 Mar");
  // The stage under way shows when it really started, never the plan's (possibly later) start.
  await expect(page.locator('tr[aria-current="step"] td').nth(1)).toHaveText(/^Started /);
  await snap(page, "slate-06-schedule");

  await page.getByRole("button", { name: "Edit details" }).click();
  await page.getByLabel("Target publish date").fill("2027-03-12");
  await page.getByRole("button", { name: "Save changes" }).click();
  // Five working days are one calendar week: every date is seven days later.
  await expect(page.getByTestId("due-build")).toHaveText("Mon 22 Feb");
  await expect(page.getByTestId("due-edit")).toHaveText("Mon 8 Mar");
  await expect(page.getByTestId("due-publish")).toHaveText("Fri 12 Mar");
  await snap(page, "slate-07-schedule-moved");
});
