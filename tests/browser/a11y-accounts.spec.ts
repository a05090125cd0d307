import { expect, test } from "@playwright/test";
import { expectNoSeriousA11yViolations } from "./axe";
import { expectHome, uniqueEmail } from "./support";

// The content security policy is helmet's; a page that breaks it logs a violation we catch here.
test("the signed-out pages and the members page pass axe-core and the content security policy", async ({ page }) => {
  const cspViolations: string[] = [];
  page.on("console", (message) => {
    if (/Content Security Policy/i.test(message.text())) cspViolations.push(message.text());
  });

  await page.goto("/sign-in");
  await expect(page.getByRole("heading", { name: "Sign in" })).toBeVisible();
  await expectNoSeriousA11yViolations(page, "sign-in");

  await page.goto("/sign-up");
  await expectNoSeriousA11yViolations(page, "sign-up");
  await page.getByLabel("Your name").fill("Ada Accessible");
  await page.getByLabel("E-mail").fill(uniqueEmail("a11y"));
  await page.getByLabel("Password").fill("a-long-enough-password");
  await page.getByLabel("Channel name").fill("Ramp Street Studio");
  await page.getByRole("button", { name: "Create account and channel" }).click();
  await expectHome(page);

  await page.getByRole("link", { name: "Members" }).click();
  await expect(page.getByRole("heading", { name: "Members" })).toBeVisible();
  await expectNoSeriousA11yViolations(page, "members");

  await page.goto(`/verify/${"x".repeat(43)}`);
  await expect(page.getByText("confirmation link is not valid")).toBeVisible();
  await expectNoSeriousA11yViolations(page, "confirmation link that isn't valid");

  await page.goto("/invite/not-a-real-token");
  await expect(page.getByText("not valid")).toBeVisible();
  await expectNoSeriousA11yViolations(page, "invitation that isn't valid");

  expect(cspViolations).toEqual([]);
});
