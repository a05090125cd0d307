import { expect, test, type Page } from "@playwright/test";
import { expectNoSeriousA11yViolations } from "./axe";
import { hostWithEpisode, snap, uniqueEmail } from "./support";

test.setTimeout(120_000);

/** A sponsor, a contact and a deal whose script draft went to the sponsor, through the sponsors' API; answers the review link. */
async function scriptSentForReview(page: Page, channelId: string, episodeId: string, csrfToken: string): Promise<string> {
  const post = async (url: string, data: object) => {
    const answer = await page.request.post(`/api/channels/${channelId}${url}`, { headers: { "x-csrf-token": csrfToken }, data });
    expect(answer.status(), `${url}: ${await answer.text()}`).toBe(201);
    return answer.json();
  };
  const { sponsor } = await post("/sponsors", { company: "Skerna Vises", website: "", notes: "" });
  const { contact } = await post(`/sponsors/${sponsor.id}/contacts`, { name: "Jonas Feld", email: uniqueEmail("desk-contact"), role: "" });
  const { template } = await post("/deal-templates", {
    name: "Script pair",
    items: [
      { kind: "script_draft", title: "Script draft", anchor: "before_publish", offsetDays: 21, ownerRole: null },
      { kind: "script_approval", title: "Sponsor approves the script", anchor: "before_publish", offsetDays: 14, ownerRole: null, approves: 0 },
    ],
  });
  const { deal } = await post("/deals", {
    episodeId,
    sponsorId: sponsor.id,
    templateId: template.id,
    state: "signed",
    placement: "opening",
    segmentSeconds: 45,
    talkingPoints: [],
    link: null,
    promoCode: null,
    disclosureText: null,
    exclusivityNotes: null,
    descriptionCopy: null,
    script: "This video is sponsored by Skerna Vises.",
    contactId: contact.id,
    hostId: null,
    goLiveDate: null,
    money: { fee: 800, currency: "EUR", paymentTermsDays: 30, paymentTermsFrom: "go_live", invoiceNumber: null, invoicedOn: null, paidOn: null },
  });
  const draft = deal.deliverables.find((d: { kind: string }) => d.kind === "script_draft");
  const { url } = await post(`/deals/${deal.id}/review-links`, { deliverableId: draft.id, contactId: contact.id });
  return url as string;
}

test("the producer's desk lists what the sponsor asked to change and changes an item's status in place, by keyboard", async ({ page, browser }) => {
  const { channelId, episodeId, csrfToken } = await hostWithEpisode(page, {
    host: { name: "Maren Holt", channel: "Holt Jig Works" },
    episode: { title: "Quick-release vise jaws", question: "Do printed jaws hold a 20 kg pull?", origin: "sponsor", stage: "build", targetPublishDate: "2027-11-20" },
  });
  const reviewUrl = await scriptSentForReview(page, channelId, episodeId, csrfToken);

  // The sponsor asks for changes to the script draft, months before it is due.
  const sponsorContext = await browser.newContext();
  const sponsor = await sponsorContext.newPage();
  await sponsor.goto(reviewUrl);
  await sponsor.getByLabel("Ask for changes").check();
  await sponsor.getByLabel("Comment").fill("Name the jaw width.");
  await sponsor.getByRole("button", { name: "Send decision" }).click();
  await expect(sponsor.getByText("your decision is recorded")).toBeVisible();
  await sponsorContext.close();

  // On the desk it is among the things to act on now, with its status as a control on the row.
  await page.goto(`/c/${channelId}/slate`);
  await page.getByRole("link", { name: "Desk" }).click();
  const asked = page.getByRole("region", { name: /The sponsor asked for changes/ });
  await expect(asked.getByRole("link", { name: "Script draft" })).toBeVisible();
  await expect(page.getByTestId("count-changes_asked")).toHaveText("1");
  const status = page.getByLabel("Status of Script draft");
  await expect(status).toHaveValue("changes_asked");
  await snap(page, "desk-01-changes-asked");
  await expectNoSeriousA11yViolations(page, "desk with a status control");

  // A save the server refuses: the old status comes back and the row says why.
  await page.route("**/api/channels/*/deliverables/*", (route) =>
    route.fulfill({ status: 503, contentType: "application/json", body: JSON.stringify({ error: { code: "unavailable", message: "Kerf is busy for a moment. Try again.", fields: {} } }) }),
  );
  await status.focus();
  await page.keyboard.press("ArrowUp"); // Changes asked → Sent
  await expect(asked.getByRole("alert")).toHaveText("Not saved: Kerf is busy for a moment. Try again.");
  await expect(status).toHaveValue("changes_asked");
  await expect(status).toBeFocused();
  await snap(page, "desk-02-refused");
  await page.unroute("**/api/channels/*/deliverables/*");

  // The same key again, saved: the item now waits on the sponsor, and the desk says so.
  await status.focus();
  await page.keyboard.press("ArrowUp");
  await expect(page.getByTestId("desk-announcement")).toHaveText('"Script draft" is now sent.');
  await expect(page.getByRole("region", { name: /Waiting on the sponsor/ }).getByLabel("Status of Script draft")).toHaveValue("sent");
  await expect(page.getByTestId("count-changes_asked")).toHaveText("0");
  await expect(page.getByRole("main").getByRole("alert")).toHaveCount(0);
  await snap(page, "desk-03-saved");

  // The record agrees: the item's history has the change, made by the producer.
  const deals = await (await page.request.get(`/api/channels/${channelId}/episodes/${episodeId}/deals`)).json();
  const draft = deals.deals[0].deliverables.find((d: { kind: string }) => d.kind === "script_draft");
  expect(draft.status).toBe("sent");
  expect(draft.history[0]).toMatchObject({ what: "status", fromStatus: "changes_asked", toStatus: "sent", actorName: "Maren Holt" });

  // On a phone the desk doesn't scroll sideways.
  await page.setViewportSize({ width: 390, height: 844 });
  await expect(status).toBeVisible();
  expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
  await snap(page, "desk-04-phone");
});
