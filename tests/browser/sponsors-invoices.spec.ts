import { expect, test } from "@playwright/test";
import { expectNoSeriousA11yViolations } from "./axe";
import { hostWithEpisode, member, signIn, signedEuroDeal, snap } from "./support";

test.setTimeout(240_000);

test("a producer invoices a deal, the sponsor pays on the provider's page, the deal shows it paid, and an editor sees none of it", async ({ page, browser }) => {
  const { channelId, episodeId, csrfToken } = await hostWithEpisode(page, {
    host: { name: "Tove Aalund", channel: "Aalund Fixture Shop" },
    episode: { title: "Cam clamps against toggle clamps", question: "Which clamp holds a 30 kg side load?", origin: "sponsor", stage: "build", targetPublishDate: "2027-06-12" },
  });
  const producerPerson = await member(channelId, "Nils Ekdahl", "producer");
  const editorPerson = await member(channelId, "Mira Solberg", "editor");
  await signedEuroDeal(page, { channelId, episodeId, csrfToken }, { company: "Brekke Clampworks", contact: "Sigrid Moe" });

  // The producer invoices the whole fee from the deal, by keyboard where a person would type.
  const producer = await signIn(browser, producerPerson.email);
  await producer.goto(`/c/${channelId}/episodes/${episodeId}#sponsor-deals`);
  const invoices = producer.getByTestId("invoices");
  // The episode page's first load makes a score of requests; on a loaded machine that takes a while.
  await expect(invoices.getByText("No invoice yet.")).toBeVisible({ timeout: 45_000 });
  await invoices.getByRole("button", { name: "New invoice" }).click();
  await invoices.getByLabel("What it is for").fill("Sponsored segment, whole fee");
  await invoices.getByLabel("Amount").press("Enter");
  const stage = invoices.getByTestId("invoice-stage");
  await expect(stage).toHaveText("Being written");
  await expect(invoices).toContainText("€1,800.50");
  await invoices.getByRole("button", { name: "Finalise" }).click();
  await expect(stage).toHaveText("Ready to send");
  await invoices.getByRole("button", { name: "Send to sponsor" }).click();
  await expect(stage).toHaveText("With the sponsor");
  const payPage = invoices.getByRole("link", { name: "Sponsor's payment page" });
  const hostedUrl = await payPage.getAttribute("href");
  expect(hostedUrl).toMatch(/\/i\//);
  await expectNoSeriousA11yViolations(producer, "invoice sent");
  await snap(producer, "invoices-sent-desk");

  // The sponsor pays on the provider's page (the stand-in's), in a browser of their own.
  const sponsorPage = await (await browser.newContext()).newPage();
  await sponsorPage.goto(hostedUrl!);
  await sponsorPage.getByRole("button", { name: /^Pay .* as the sponsor$/ }).click();

  // The provider's signed event reaches Kerf, and the producer's page shows it paid.
  await expect(stage).toHaveText("Paid", { timeout: 30_000 });
  await expect(invoices).toContainText("paid");
  await producer.setViewportSize({ width: 390, height: 844 });
  await snap(producer, "invoices-paid-phone");
  // The invoices fit the phone's width (the episode page around them is checked by its own journeys).
  const box = await invoices.boundingBox();
  expect(box!.x + box!.width).toBeLessThanOrEqual(390);

  // The editor's session sees no invoice, on the page or from the API.
  const editor = await signIn(browser, editorPerson.email);
  await editor.goto(`/c/${channelId}/episodes/${episodeId}#sponsor-deals`);
  await expect(editor.getByRole("article", { name: "Deal with Brekke Clampworks" })).toBeVisible();
  await expect(editor.getByTestId("invoices")).toHaveCount(0);
  await expect(editor.getByText("€1,800.50")).toHaveCount(0);
  const dealsAnswer = await editor.request.get(`/api/channels/${channelId}/episodes/${episodeId}/deals`);
  const dealId = (await dealsAnswer.json()).deals[0].id as string;
  expect((await editor.request.get(`/api/channels/${channelId}/deals/${dealId}/invoices`)).status()).toBe(403);
  expect((await editor.request.get(`/api/channels/${channelId}/invoices/overdue`)).status()).toBe(403);
});
