import { expect, test } from "@playwright/test";
import { expectNoSeriousA11yViolations } from "./axe";
import { MAIL_POLL_INTERVALS, PASSWORD, expectHome, signUpThroughApi, snap, uniqueEmail } from "./support";

const NEW_PASSWORD = "a-fresh-bench-passphrase";

/** Waits until the mail stand-in holds a message to `address` with this subject, and answers the newest. */
async function mailWithSubject(address: string, subject: string): Promise<{ text: string }> {
  let found: { text: string }[] = [];
  await expect
    .poll(
      async () => {
        const all = (await (await fetch(`${process.env.KERF_TEST_MAIL_WEB_URL}/api/email`)).json()) as { text: string; subject: string; to: { address: string }[] }[];
        found = all.filter((m) => m.subject === subject && m.to.some((t) => t.address === address));
        return found.length;
      },
      { timeout: 15_000, intervals: MAIL_POLL_INTERVALS, message: `"${subject}" to ${address}` },
    )
    .toBeGreaterThan(0);
  return found[found.length - 1]!;
}

test("a host who forgot the password gets a link by mail, sets a new one, and the browser still signed in is signed out", async ({ page, browser }) => {
  test.setTimeout(150_000);
  const email = uniqueEmail("forgetful");
  // The older session: signed in on one browser, and left open.
  const { channelId } = await signUpThroughApi(page, { name: "Ines Okafor", email, channel: "Lathe Lane" });
  await page.goto(`/c/${channelId}/slate`);
  await expect(page.getByRole("heading", { name: "Slate" })).toBeVisible();

  const other = await (await browser.newContext()).newPage();
  await other.goto("/sign-in");
  await other.getByRole("link", { name: "Forgot your password?" }).click();
  await expect(other.getByRole("heading", { name: "Choose a new password" })).toBeVisible();
  await other.getByRole("button", { name: "Mail me a link" }).click();
  await expect(other.getByText("Enter a valid e-mail address.")).toBeVisible();
  await other.getByLabel("E-mail").fill(email);
  await other.getByRole("button", { name: "Mail me a link" }).click();
  await expect(other.getByRole("heading", { name: "Check your mail" })).toBeVisible();
  await expect(other.getByRole("status")).toContainText("If that address has a Kerf account");
  await snap(other, "account-01-link-asked");

  const mail = await mailWithSubject(email, "Set a new password for Kerf");
  const link = mail.text.match(/https?:\/\/\S+\/new-password\/[A-Za-z0-9_-]+/)![0];
  await other.goto(new URL(link).pathname);
  await expect(other.getByRole("heading", { name: "Set a new password" })).toBeVisible();
  await other.getByLabel("New password", { exact: true }).fill(NEW_PASSWORD);
  await other.getByLabel("New password again").fill("not-the-same-passphrase");
  await other.getByRole("button", { name: "Set password" }).click();
  await expect(other.getByText("The two passwords differ.")).toBeVisible();
  await other.getByLabel("New password again").fill(NEW_PASSWORD);
  await other.getByRole("button", { name: "Set password" }).click();
  await expect(other.getByRole("heading", { name: "Password changed" })).toBeVisible();
  await snap(other, "account-02-password-set");

  // The link works once.
  await other.goto(new URL(link).pathname);
  await other.getByLabel("New password", { exact: true }).fill("another-passphrase-here");
  await other.getByLabel("New password again").fill("another-passphrase-here");
  await other.getByRole("button", { name: "Set password" }).click();
  await expect(other.getByRole("alert")).toContainText("already been used");

  // The browser that was signed in before is signed out at its next step.
  await page.reload();
  await expect(page.getByRole("heading", { name: "Sign in" })).toBeVisible();
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill(PASSWORD);
  await page.getByRole("button", { name: "Sign in" }).click();
  await expect(page.getByRole("alert")).toContainText("don't match");
  await page.getByLabel("Password").fill(NEW_PASSWORD);
  await page.getByRole("button", { name: "Sign in" }).click();
  // Signed out on the slate, the sign-in leads back there.
  await expect(page.getByRole("heading", { name: "Slate" })).toBeVisible();
  await other.context().close();
});

test("a member changes name, time zone and mail on the account page, signs out another browser, and the page fits a phone", async ({ page, browser }) => {
  // Two browsers, two sign-ins and an accessibility pass: longer than one page's journey.
  test.setTimeout(150_000);
  const email = uniqueEmail("settings");
  const { channelId } = await signUpThroughApi(page, { name: "Tomas Rike", email, channel: "Solder Shed" });
  await page.goto(`/c/${channelId}/home`);
  const other = await (await browser.newContext()).newPage();
  await other.goto("/sign-in");
  await other.getByLabel("E-mail").fill(email);
  await other.getByLabel("Password").fill(PASSWORD);
  await other.getByRole("button", { name: "Sign in" }).click();
  await expectHome(other);

  await page.getByRole("link", { name: "Your account (Tomas Rike)" }).click();
  await expect(page.getByRole("heading", { name: "Your account" })).toBeVisible();
  await page.getByLabel("Your name").fill("Tomas Rikeman");
  await page.getByLabel("Time zone").selectOption("Pacific/Auckland");
  await page.getByLabel("Due-date reminders").uncheck();
  await page.getByRole("button", { name: "Save settings" }).click();
  await expect(page.getByRole("status").filter({ hasText: "Saved." })).toBeVisible();
  await expect(page.getByRole("link", { name: "Your account (Tomas Rikeman)" })).toBeVisible();
  await page.reload();
  await expect(page.getByLabel("Time zone")).toHaveValue("Pacific/Auckland");
  await expect(page.getByLabel("Due-date reminders")).not.toBeChecked();
  await expect(page.getByLabel("Mentions")).toBeChecked();

  const sessions = page.getByRole("list", { name: "Sessions" });
  await expect(sessions.getByRole("listitem")).toHaveCount(2);
  await expect(sessions.getByText("This browser")).toHaveCount(1);
  // Times are shown in the zone just chosen (New Zealand: UTC+12, or +13 in its summer).
  await expect(sessions).toContainText(/UTC\+1[23]/);
  await snap(page, "account-03-settings");
  await expectNoSeriousA11yViolations(page, "account page");

  await page.getByRole("button", { name: "Sign out everywhere else" }).click();
  await expect(page.getByRole("status").filter({ hasText: "Signed out of 1 other session." })).toBeVisible();
  await expect(sessions.getByRole("listitem")).toHaveCount(1);
  await other.reload();
  await expect(other.getByRole("heading", { name: "Sign in" })).toBeVisible();

  // A wrong current password is refused beside its field.
  const passwordForm = page.locator("form[aria-labelledby=password-title]");
  await passwordForm.getByLabel("Current password").fill("not-my-password");
  await passwordForm.getByLabel("New password").fill(NEW_PASSWORD);
  await passwordForm.getByRole("button", { name: "Change password" }).click();
  await expect(passwordForm.getByText("That is not your current password.")).toBeVisible();

  await page.setViewportSize({ width: 390, height: 844 });
  await expect(page.getByRole("heading", { name: "Your account" })).toBeVisible();
  expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
  await snap(page, "account-04-settings-phone");
  await other.context().close();
});
