import { expect, test } from "@playwright/test";
import { hostWithEpisode, member, signIn, snap, sql } from "./support";

test.setTimeout(180_000);

const stale = /Someone else changed this (deal|test plan) a moment ago\. You now see their version; make your change again if it still applies\./;

test("two people edit the same deal and test plan: the second save shows the first one's version instead of overwriting it", async ({ page, browser }) => {
  const { channelId, episodeId } = await hostWithEpisode(page, {
    host: { name: "Sunniva Holt", channel: "Tidewater Rig" },
    episode: { title: "Winch line under shock load", question: "Which line survives a 3 m drop?", origin: "sponsor", stage: "test_plan" },
  });
  const [sponsor] = await sql<{ id: string }>("insert into sponsors (channel_id, company) values ($1, 'Strandline Ropes') returning id", [channelId]);
  await sql(
    `insert into deals (channel_id, episode_id, sponsor_id, placement, segment_seconds, link, promo_code, fee_amount, currency, payment_terms_days, payment_terms_from)
     values ($1, $2, $3, 'middle', 60, 'https://strandline.example/first', 'FIRST5', '900.00', 'EUR', 30, 'invoice')`,
    [channelId, episodeId, sponsor!.id],
  );
  const producer = await signIn(browser, (await member(channelId, "Per Aune", "producer")).email);
  const episodePage = `/c/${channelId}/episodes/${episodeId}`;
  await page.goto(`${episodePage}/sponsor-deals`);
  await producer.goto(`${episodePage}/sponsor-deals`);

  // Both open the deal's requirements; the producer saves a new link first.
  const ownerDeal = page.locator("#sponsor-deals");
  const producerDeal = producer.locator("#sponsor-deals");
  await ownerDeal.getByRole("button", { name: "Edit requirements" }).click();
  await producerDeal.getByRole("button", { name: "Edit requirements" }).click();
  await producerDeal.getByLabel("Link").fill("https://strandline.example/winch");
  await producerDeal.getByRole("button", { name: "Save requirements" }).click();
  await expect(producerDeal.getByTestId("segment-link")).toHaveText("https://strandline.example/winch");

  // The owner, still on the version they opened, changes the promo code: refused, and shown the producer's link.
  const ownerForm = page.getByRole("form", { name: "Segment requirements" });
  await ownerForm.getByLabel("Promo code").fill("WINCH10");
  await ownerForm.getByRole("button", { name: "Save requirements" }).click();
  await expect(ownerForm.getByText(stale)).toBeVisible();
  await expect(ownerForm.getByLabel("Link")).toHaveValue("https://strandline.example/winch");
  await expect(ownerForm.getByLabel("Promo code")).toHaveValue("FIRST5");
  await snap(page, "conflicts-01-deal-stale");

  // Made again on the producer's version, the owner's change lands beside the producer's.
  await ownerForm.getByLabel("Promo code").fill("WINCH10");
  await ownerForm.getByRole("button", { name: "Save requirements" }).click();
  await expect(ownerDeal.getByTestId("segment-code")).toHaveText("WINCH10");
  await expect(ownerDeal.getByTestId("segment-link")).toHaveText("https://strandline.example/winch");

  // The test plan: the same story on the bench's sheet.
  const ownerPlan = page.getByRole("form", { name: "Test plan" });
  const producerPlan = producer.getByRole("form", { name: "Test plan" });
  await page.getByRole("navigation", { name: "Parts of the episode" }).getByRole("link", { name: "Test plan" }).click();
  await expect(ownerPlan.getByLabel("Method")).toBeVisible();
  await producer.goto(`${episodePage}/test-plan`);
  await expect(producerPlan.getByLabel("Hypothesis")).toBeVisible();
  await producerPlan.getByLabel("Hypothesis").fill("The braided line holds a 3 m drop of 20 kg.");
  await producerPlan.getByRole("button", { name: "Save the test plan" }).click();
  await expect(producer.getByText("Test plan saved.")).toBeVisible();
  await ownerPlan.getByLabel("Method").fill("Drop the mass from 3 m on each line, five times.");
  await ownerPlan.getByRole("button", { name: "Save the test plan" }).click();
  await expect(page.getByText(stale)).toBeVisible();
  await expect(ownerPlan.getByLabel("Hypothesis")).toHaveValue("The braided line holds a 3 m drop of 20 kg.");
  await snap(page, "conflicts-02-test-plan-stale");
});
