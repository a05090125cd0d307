import { expect, test } from "@playwright/test";
import { expectHome, homeToSlate, latestMailTo, snap, uniqueEmail } from "./support";

const PASSWORD = "a-long-enough-password";

test("a newcomer starts a channel, signs out and signs back in", async ({ page }) => {
  const email = uniqueEmail("host");
  await page.goto("/");
  await expect(page.getByRole("heading", { name: "Sign in" })).toBeVisible();
  await snap(page, "01-sign-in");

  await page.getByRole("link", { name: "Start a channel" }).click();
  await page.getByRole("button", { name: "Create account and channel" }).click();
  await expect(page.getByText("Enter your name.")).toBeVisible();
  await snap(page, "02-sign-up-errors");

  await page.getByLabel("Your name").fill("Rhea Castellanos");
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill(PASSWORD);
  await page.getByLabel("Channel name").fill("Quarry Road Lab");
  await page.getByRole("button", { name: "Create account and channel" }).click();
  await expectHome(page);
  await expect(page.getByText("Nothing needs you today")).toBeVisible();
  await homeToSlate(page);
  await expect(page.getByText("No episodes yet")).toBeVisible();
  await snap(page, "03-empty-slate");

  await page.getByRole("button", { name: "Sign out" }).click();
  await expect(page.getByRole("heading", { name: "Sign in" })).toBeVisible();

  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill("not-the-password");
  await page.getByRole("button", { name: "Sign in" }).click();
  await expect(page.getByRole("alert")).toContainText("don't match");
  await snap(page, "04-wrong-password");

  await page.getByLabel("Password").fill(PASSWORD);
  await page.getByRole("button", { name: "Sign in" }).click();
  // Signed out from the slate, the sign-in leads back there rather than to the home.
  await expect(page.getByRole("heading", { name: "Slate" })).toBeVisible();
  await expect(page.getByLabel("Channel", { exact: true })).toHaveValue(/.+/);
});

test("an owner confirms their address, invites a crew member, who joins from the e-mailed link", async ({ page, browser }) => {
  test.setTimeout(120_000);
  const ownerEmail = uniqueEmail("owner");
  const crewEmail = uniqueEmail("crew");
  await page.goto("/sign-up");
  await page.getByLabel("Your name").fill("Jonas Ferreira");
  await page.getByLabel("E-mail").fill(ownerEmail);
  await page.getByLabel("Password").fill(PASSWORD);
  await page.getByLabel("Channel name").fill("Kiln Street Makers");
  await page.getByRole("button", { name: "Create account and channel" }).click();
  await page.getByRole("link", { name: "Members" }).click();
  await expect(page.getByRole("heading", { name: "Members" })).toBeVisible();

  // Until the owner's own address is confirmed, Kerf sends no invitation for them, and says why.
  const confirmNotice = page.getByRole("region", { name: "Confirm your address" });
  await expect(confirmNotice).toContainText(ownerEmail);
  await page.getByLabel("E-mail", { exact: true }).fill(crewEmail);
  await page.getByLabel("Role", { exact: true }).selectOption("crew");
  await page.getByRole("button", { name: "Send invitation" }).click();
  await expect(page.getByRole("alert")).toContainText("Confirm your e-mail address first");
  await confirmNotice.getByRole("button", { name: "Send the mail again" }).click();
  await expect(confirmNotice.getByRole("status")).toContainText(`Sent to ${ownerEmail}`);
  await snap(page, "05a-confirm-address-first");
  await page.setViewportSize({ width: 390, height: 844 });
  expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
  await snap(page, "05a-confirm-address-first-phone");
  await page.setViewportSize({ width: 1280, height: 720 });

  const confirmation = await latestMailTo(ownerEmail);
  await page.goto(confirmation.text.match(/https?:\/\/\S+\/verify\/\S+/)![0]);
  await expect(page.getByRole("heading", { name: "Address confirmed" })).toBeVisible();
  await snap(page, "05b-address-confirmed");
  await page.getByRole("link", { name: "Go to Kerf" }).click();
  await page.getByRole("link", { name: "Members" }).click();
  await expect(page.getByRole("heading", { name: "Members" })).toBeVisible();
  await expect(confirmNotice).toHaveCount(0);

  await page.getByLabel("E-mail", { exact: true }).fill(crewEmail);
  await page.getByLabel("Role", { exact: true }).selectOption("crew");
  await page.getByRole("button", { name: "Send invitation" }).click();
  await expect(page.getByText(`Invitation sent to ${crewEmail}`)).toBeVisible();
  await expect(page.getByText(crewEmail, { exact: true })).toBeVisible();
  await snap(page, "05-members-with-invitation");

  const mail = await latestMailTo(crewEmail);
  const link = mail.text.match(/https?:\/\/\S+\/invite\/\S+/)?.[0];
  // The link leads to this server's own invitation page.
  expect(link, mail.text).toMatch(/\/invite\/\S+$/);
  expect(new URL(link!).origin).toBe(new URL(page.url()).origin);

  // The link is for the crew member's address: the signed-in owner is told so, with nothing to press.
  await page.goto(link!);
  await expect(page.getByRole("alert")).toContainText(`This invitation is for ${crewEmail}`);
  await expect(page.getByRole("button", { name: /Join as/ })).toHaveCount(0);
  await snap(page, "05c-invitation-for-another-address");
  await page.goBack();
  await expect(page.getByRole("heading", { name: "Members" })).toBeVisible();

  const crewContext = await browser.newContext();
  const crew = await crewContext.newPage();
  await crew.goto(link!);
  await expect(crew.getByRole("heading", { name: "Join Kiln Street Makers" })).toBeVisible();
  await snap(crew, "06-accept-invitation");
  await crew.getByLabel("Your name").fill("Mina Sato");
  await crew.getByLabel("Choose a password").fill(PASSWORD);
  await crew.getByRole("button", { name: "Create account and join" }).click();
  await expectHome(crew);
  await expect(crew.getByRole("banner").getByText("Crew", { exact: true })).toBeVisible();
  // Crew cannot manage members, so the page is not offered.
  await expect(crew.getByRole("link", { name: "Members" })).toHaveCount(0);
  await snap(crew, "07-crew-slate");

  await crew.goto(link!);
  await expect(crew.getByText("already been used")).toBeVisible();
  await snap(crew, "08-invitation-used");
  await crewContext.close();

  await page.reload();
  await expect(page.getByLabel("Role of Mina Sato")).toHaveValue("crew");
});
