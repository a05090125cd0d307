import { expect, test } from "@playwright/test";
import { PASSWORD, expectHome, signUpThroughApi, snap, uniqueEmail } from "./support";

/*
 * Finding: a sign-in link whose `next` named another site ended on the router's error page with a
 * stack trace. Only paths inside Kerf are followed; anything else leads home.
 */
test("a sign-in link that names another site leads to Kerf's own pages", async ({ page, baseURL }) => {
  const email = uniqueEmail("next");
  await signUpThroughApi(page, { name: "Nell Next", email, channel: "Redirect Works" });

  // Signed in already: the sign-in page sends the person on, but never off-site.
  await page.goto(`/sign-in?next=${encodeURIComponent("//evil.example/steal")}`);
  await expectHome(page);
  expect(new URL(page.url()).origin).toBe(new URL(baseURL!).origin);

  await page.getByRole("button", { name: "Sign out" }).click();
  await expect(page.getByRole("heading", { name: "Sign in" })).toBeVisible();
  await page.goto(`/sign-in?next=${encodeURIComponent("https://evil.example/phish")}`);
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill(PASSWORD);
  await page.getByRole("button", { name: "Sign in" }).click();
  await expectHome(page);
  expect(new URL(page.url()).origin).toBe(new URL(baseURL!).origin);
  await expect(page.getByText(/unexpected application error|stack/i)).toHaveCount(0);
  await snap(page, "sign-in-next-outside-site");
});
