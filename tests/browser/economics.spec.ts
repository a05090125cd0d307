import { expect, test } from "@playwright/test";
import { expectNoSeriousA11yViolations } from "./axe";
import { DESK, expectFitsPhone, hostWithEpisode, member, PHONE, signIn, signedEuroDeal, snap } from "./support";

test.setTimeout(240_000);

test("a producer records a cost, invoices a deal, the sponsor pays, and the margin follows; an editor sees none of the money", async ({ page, browser }) => {
  const { channelId, episodeId, csrfToken } = await hostWithEpisode(page, {
    host: { name: "Ruta Vaskelis", channel: "Vaskelis Jig Bench" },
    episode: { title: "Dowel jig against pocket screws", question: "Which joint holds a 40 kg shelf?", origin: "sponsor", stage: "build", targetPublishDate: "2027-06-12" },
  });
  const producerPerson = await member(channelId, "Arvo Lepik", "producer");
  const editorPerson = await member(channelId, "Ilze Berzina", "editor");
  await signedEuroDeal(page, { channelId, episodeId, csrfToken }, { company: "Kalnins Joinery Supply", contact: "Liga Ozola" });

  // The producer records what the timber cost on the episode's money part.
  const producer = await signIn(browser, producerPerson.email);
  await producer.setViewportSize(DESK);
  await producer.goto(`/c/${channelId}/episodes/${episodeId}/money`);
  const margin = producer.getByTestId("margin-so-far");
  await expect(margin).toHaveText("+€0.00", { timeout: 45_000 });
  await producer.getByRole("button", { name: "Add a line" }).click();
  await producer.getByLabel("What was bought").fill("Beech dowels and oak boards");
  await producer.getByLabel("Where it was bought").fill("Timber yard");
  await producer.getByLabel("Amount").fill("120");
  await producer.getByLabel("Amount").press("Enter");
  await expect(margin).toHaveText("−€120.00");

  // The producer invoices the whole fee from the deal, and sends it.
  await producer.goto(`/c/${channelId}/episodes/${episodeId}/sponsor-deals`);
  const invoices = producer.getByTestId("invoices");
  await expect(invoices.getByText("No invoice yet.")).toBeVisible({ timeout: 45_000 });
  await invoices.getByRole("button", { name: "New invoice" }).click();
  await invoices.getByLabel("What it is for").fill("Sponsored segment, whole fee");
  await invoices.getByLabel("Amount").press("Enter");
  const stage = invoices.getByTestId("invoice-stage");
  await expect(stage).toHaveText("Being written");
  await invoices.getByRole("button", { name: "Finalise" }).click();
  await expect(stage).toHaveText("Ready to send");
  await invoices.getByRole("button", { name: "Send to sponsor" }).click();
  await expect(stage).toHaveText("With the sponsor");
  const hostedUrl = await invoices.getByRole("link", { name: "Sponsor's payment page" }).getAttribute("href");

  // The money part waits for the payment: invoiced, not paid.
  await producer.goto(`/c/${channelId}/episodes/${episodeId}/money`);
  await expect(producer.getByTestId("deal-paid")).toHaveText("paid €0.00", { timeout: 45_000 });

  // The sponsor pays on the provider's page (the stand-in's), in a browser of their own.
  const sponsorPage = await (await browser.newContext()).newPage();
  await sponsorPage.goto(hostedUrl!);
  await sponsorPage.getByRole("button", { name: /^Pay .* as the sponsor$/ }).click();

  // The provider's signed event reaches Kerf; the margin follows without a reload.
  await expect(producer.getByTestId("deal-paid")).toHaveText("paid €1,800.50", { timeout: 30_000 });
  await expect(margin).toHaveText("+€1,680.50");
  await expectNoSeriousA11yViolations(producer, "episode money");
  await snap(producer, "economics-episode-desk");
  await producer.setViewportSize(PHONE);
  await expectFitsPhone(producer, "episode money");
  await snap(producer, "economics-episode-phone");

  // The channel's page shows the month's margin, as a chart and as a table.
  await producer.setViewportSize(DESK);
  await producer.goto(`/c/${channelId}/money`);
  await expect(producer.getByRole("img", { name: "Margin per month in EUR" })).toBeVisible({ timeout: 45_000 });
  await expect(producer.getByRole("table")).toContainText("+€1,680.50");
  await expectNoSeriousA11yViolations(producer, "channel money");
  await snap(producer, "economics-channel-desk");
  await producer.setViewportSize(PHONE);
  await expectFitsPhone(producer, "channel money");
  await snap(producer, "economics-channel-phone");
  const csv = await producer.request.get(`/api/channels/${channelId}/money.csv`);
  expect(await csv.text()).toContain("Sponsor payment");

  // The editor's session sees no money: no page in the menu, no part on the episode, nothing from the API.
  const editor = await signIn(browser, editorPerson.email);
  await editor.setViewportSize(DESK);
  await editor.goto(`/c/${channelId}/episodes/${episodeId}/money`);
  await expect(editor.getByRole("link", { name: "Slate" }).first()).toBeVisible({ timeout: 45_000 });
  await expect(editor.getByRole("link", { name: "Money" })).toHaveCount(0);
  await expect(editor.getByTestId("margin-so-far")).toHaveCount(0);
  await expect(editor.getByText("Costs and income")).toHaveCount(0);
  await expect(editor.getByText("€1,680.50")).toHaveCount(0);
  expect((await editor.request.get(`/api/channels/${channelId}/episodes/${episodeId}/money`)).status()).toBe(403);
  expect((await editor.request.get(`/api/channels/${channelId}/money`)).status()).toBe(403);
  expect((await editor.request.get(`/api/channels/${channelId}/money.csv`)).status()).toBe(403);
  await editor.goto(`/c/${channelId}/money`);
  await expect(editor.getByText("Not for your role")).toBeVisible();
});
