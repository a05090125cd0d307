import { expect, test, type Page } from "@playwright/test";
import { expectNoSeriousA11yViolations } from "./axe";
import { DESK, expectFitsPhone, latestMailTo, MAIL_POLL_INTERVALS, PHONE, signUpThroughApi, snap, sql, uniqueEmail } from "./support";

test.setTimeout(240_000);

async function toAsks(page: Page) {
  const menu = page.getByRole("button", { name: "Menu" });
  if (await menu.isVisible()) await menu.click();
  await page.getByRole("navigation", { name: "Channel pages" }).getByRole("link", { name: "Asks" }).click();
  await expect(page.getByRole("heading", { name: "Viewer asks" })).toBeVisible({ timeout: 60_000 });
}

const card = (page: Page, wording: string) => page.getByRole("article", { name: wording });

test("viewers suggest signed out; a member folds two ideas together, weighs one and puts it on the slate; at go-live the viewer who asked gets one mail", async ({ page, browser }) => {
  await page.setViewportSize(DESK);
  const { channelId } = await signUpThroughApi(page, { name: "Maren Tollef", email: uniqueEmail("host"), channel: "Skerry Workshop" });
  await page.goto(`/c/${channelId}/home`);
  await toAsks(page);
  await expect(page.getByText("No open ideas yet")).toBeVisible();
  await page.getByLabel("Take suggestions on the public page").check();
  await page.getByLabel("Prompt shown to visitors").fill("What should we try to build next?");
  await page.getByRole("button", { name: "Save the page" }).click();
  await expect(page.getByText("Saved.")).toBeVisible();

  // Two viewers, signed out, in browsers of their own; the first wants to hear when it's out.
  const viewerEmail = uniqueEmail("viewer");
  const visitor = await (await browser.newContext()).newPage();
  await visitor.goto(`/suggest/${channelId}`);
  await expect(visitor.getByRole("heading", { name: "Suggest a challenge to Skerry Workshop" })).toBeVisible({ timeout: 60_000 });
  await expect(visitor.getByText("What should we try to build next?")).toBeVisible();
  await expectNoSeriousA11yViolations(visitor, "the public suggestion page");
  await visitor.getByLabel("Your suggestion").fill("A hovercraft made from a leaf blower");
  await visitor.getByLabel("Your e-mail (optional)").fill(viewerEmail);
  await visitor.getByRole("checkbox", { name: /may write to this address once/ }).check();
  await visitor.getByRole("button", { name: "Send the suggestion" }).click();
  await expect(visitor.getByText(/Thank you: the channel has your suggestion\. We've sent a link/)).toBeVisible();
  await snap(visitor, "intake-public-page-desk");
  await visitor.setViewportSize(PHONE);
  await expectFitsPhone(visitor, "the public suggestion page");
  await snap(visitor, "intake-public-page-phone");

  const other = await (await browser.newContext()).newPage();
  await other.goto(`/suggest/${channelId}`);
  await other.getByLabel("Your suggestion").fill("Ride on an air cushion you built from garden tools");
  await other.getByRole("button", { name: "Send the suggestion" }).click();
  await expect(other.getByText("Thank you: the channel has your suggestion.")).toBeVisible({ timeout: 30_000 });

  // The first viewer confirms the address from the mail.
  const confirmation = await latestMailTo(viewerEmail);
  const link = /https?:\/\/\S+\/suggest\/confirm\/\S+/.exec(confirmation.text)![0];
  await visitor.goto(new URL(link).pathname);
  await visitor.getByRole("button", { name: "Confirm my address" }).click();
  await expect(visitor.getByText("Thank you: your address is confirmed.")).toBeVisible();

  // The member folds the second idea into the first, weighs it and puts it on the slate.
  await page.reload();
  const hover = card(page, "A hovercraft made from a leaf blower");
  await expect(hover).toBeVisible({ timeout: 60_000 });
  await hover.getByLabel("Same ask as").selectOption({ label: "Ride on an air cushion you built from garden tools" });
  await hover.getByRole("button", { name: "Fold it into this idea" }).click();
  await expect(hover.getByText("2 people asked (2 suggestions)")).toBeVisible();
  await expect(card(page, "Ride on an air cushion you built from garden tools")).toHaveCount(0);

  await hover.getByText("Weigh it").click();
  await hover.getByLabel("Draw").selectOption("3");
  await hover.getByLabel("Within reach").selectOption("2");
  await hover.getByLabel("Spend").selectOption("1");
  await hover.getByLabel("Danger").selectOption("3");
  await hover.getByRole("button", { name: "Save my judgement" }).click();
  // (3 + 2 + (4 − 1) + (4 − 3)) / 4 = 2.25, shown to one decimal.
  await expect(hover.getByText("2.3 of 3")).toBeVisible();
  await expectNoSeriousA11yViolations(page, "the viewer asks page");
  await snap(page, "intake-ideas-desk");
  await page.setViewportSize(PHONE);
  await expectFitsPhone(page, "the viewer asks page");
  await snap(page, "intake-ideas-phone");
  await page.setViewportSize(DESK);

  await hover.getByRole("button", { name: "Put it on the slate" }).click();
  await expect(hover).toHaveCount(0);
  await page.getByLabel("Ideas to show").selectOption("promoted");
  await card(page, "A hovercraft made from a leaf blower").getByRole("link", { name: "Open its episode" }).click();
  await expect(page.getByRole("heading", { name: "A hovercraft made from a leaf blower" }).first()).toBeVisible({ timeout: 60_000 });
  await expect(page.getByText("A viewer's suggestion").first()).toBeVisible({ timeout: 30_000 });
  await expect(page.getByText(/^Asked by 2 viewers/).first()).toBeVisible();
  const episodeId = /\/episodes\/([0-9a-f-]{36})/.exec(page.url())![1]!;

  // The video goes live (through the publish API): the confirmed viewer gets exactly one mail with its link.
  const csrf = (await (await page.request.get("/api/auth/me")).json()).csrfToken as string;
  const live = await page.request.post(`/api/channels/${channelId}/episodes/${episodeId}/publish/go-live`, {
    headers: { "x-csrf-token": csrf },
    data: { videoUrl: "https://video.example/watch/hovercraft", reason: "The package is checked in its own journey." },
  });
  expect(live.status(), await live.text()).toBe(200);
  const news = await waitForNews(viewerEmail);
  expect(news.subject).toBe("Skerry Workshop made the video you asked for");
  expect(news.text).toContain("https://video.example/watch/hovercraft");
  await expect
    .poll(async () => (await sql<{ state: string }>("select state from pgboss.job where data->>'kind' = 'intake-news' and data->'data'->>'episodeId' = $1", [episodeId])).map((j) => j.state), { timeout: 30_000 })
    .toEqual(["completed"]);
  const mails = (await (await fetch(`${process.env.KERF_TEST_MAIL_WEB_URL}/api/email`)).json()) as { subject: string; to: { address: string }[] }[];
  expect(mails.filter((m) => m.to.some((t) => t.address === viewerEmail)).map((m) => m.subject)).toEqual(["Confirm your address for Skerry Workshop", "Skerry Workshop made the video you asked for"]);
});

async function waitForNews(address: string) {
  let found: { subject: string; text: string } | undefined;
  await expect
    .poll(
      async () => {
        const all = (await (await fetch(`${process.env.KERF_TEST_MAIL_WEB_URL}/api/email`)).json()) as { subject: string; text: string; to: { address: string }[] }[];
        found = all.find((m) => m.to.some((t) => t.address === address) && !m.subject.startsWith("Confirm"));
        return Boolean(found);
      },
      { timeout: 30_000, intervals: MAIL_POLL_INTERVALS, message: `the news mail to ${address}` },
    )
    .toBe(true);
  return found!;
}
