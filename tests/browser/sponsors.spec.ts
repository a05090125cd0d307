import { expect, test, type Page } from "@playwright/test";
import { hostWithEpisode, latestMailTo, member, signIn, snap, uniqueEmail } from "./support";

const dueOf = (page: Page, kind: string) => page.getByTestId(`item-${kind}`).getByTestId("due-date");

test.setTimeout(180_000);

test("a producer runs a deal from template to the sponsor's review, and the editor sees the segment but no fee", async ({ page, browser }) => {
  const { channelId, episodeId } = await hostWithEpisode(page, {
    host: { name: "Ingrid Vass", channel: "Millrace Bench Works" },
    episode: { title: "Bench supplies under load", question: "Which supply holds its voltage at 5 A?", origin: "sponsor", stage: "sponsor_read", targetPublishDate: "2027-03-02" },
  });
  const producerPerson = await member(channelId, "Otto Brandvik", "producer");
  const editorPerson = await member(channelId, "Ylva Kaur", "editor");
  const contactEmail = uniqueEmail("sponsor-contact");

  // The producer sets up the sponsor, its contact and a template.
  const producer = await signIn(browser, producerPerson.email);
  await producer.getByRole("link", { name: "Sponsors" }).click();
  await expect(producer.getByText("No sponsors yet")).toBeVisible();
  await snap(producer, "sponsors-01-empty");
  const addSponsor = producer.getByRole("form", { name: "Add a sponsor" });
  await addSponsor.getByRole("button", { name: "Add sponsor" }).click();
  await expect(addSponsor.getByText("Name the company.")).toBeVisible();
  await addSponsor.getByLabel("Company").fill("Halvard Power Supplies");
  await addSponsor.getByLabel("Website").fill("https://halvard.example");
  await addSponsor.getByRole("button", { name: "Add sponsor" }).click();
  const addContact = producer.getByRole("form", { name: "Add a contact" });
  await addContact.getByLabel("Contact name").fill("Rosa Lindgren");
  await addContact.getByLabel("Contact e-mail").fill(contactEmail);
  await addContact.getByRole("button", { name: "Add contact" }).click();
  await expect(producer.getByText(contactEmail)).toBeVisible();

  await producer.getByRole("button", { name: "New template" }).click();
  const templateForm = producer.getByRole("form", { name: "New template" });
  await templateForm.getByLabel("Template name").fill("Mid-roll read");
  // The suggested outline pairs each approval with what it approves: the sponsor's approval of a sent item carries to it.
  await expect(templateForm.getByLabel("Approval of, item 2")).toHaveValue("0");
  await expect(templateForm.getByLabel("Approval of, item 2").locator("option:checked")).toHaveText("Approves: Script draft to the sponsor");
  await snap(producer, "sponsors-02a-template-form");
  await templateForm.getByRole("button", { name: "Save template" }).click();
  await expect(producer.getByRole("heading", { name: "Mid-roll read" })).toBeVisible();
  await snap(producer, "sponsors-02-sponsor-and-template");

  // A deal on the episode, from the template: its items are dated from the publish date.
  await producer.goto(`/c/${channelId}/episodes/${episodeId}/sponsor-deals`);
  const deals = producer.locator("#sponsor-deals");
  await deals.getByRole("button", { name: "New deal" }).click();
  const dealForm = producer.getByRole("form", { name: "New deal" });
  await dealForm.getByLabel("Sponsor", { exact: true }).selectOption({ label: "Halvard Power Supplies" });
  await dealForm.getByLabel("Contact").selectOption({ label: `Rosa Lindgren (${contactEmail})` });
  await dealForm.getByLabel("Deliverables from template").selectOption({ label: "Mid-roll read" });
  await dealForm.getByLabel("Required talking points").fill("Holds 0.1 mV ripple\nFree shipping over 50 euros");
  await dealForm.getByLabel("Link").fill("https://halvard.example/millrace");
  await dealForm.getByLabel("Promo code").fill("MILLRACE10");
  await dealForm.getByLabel("Fee").fill("-3");
  await dealForm.getByRole("button", { name: "Create deal" }).click();
  await expect(dealForm.getByText("The fee must be zero or more.")).toBeVisible();
  await snap(producer, "sponsors-03-deal-form-errors");
  await dealForm.getByLabel("Fee").fill("2,750.00");
  await dealForm.getByRole("button", { name: "Create deal" }).click();
  await expect(deals.getByRole("heading", { name: "Halvard Power Supplies" })).toBeVisible();
  // 2 March 2027 − 7 days = 23 February (2027 has no 29 February); + 30 days after go-live = 1 April.
  await expect(dueOf(producer, "draft_cut")).toHaveText("Tue 23 Feb 2027");
  await expect(dueOf(producer, "report")).toHaveText("Thu 1 Apr 2027");
  await expect(deals.getByTestId("deal-fee")).toContainText("2,750");
  await snap(producer, "sponsors-04-deal-with-items");

  // The publish date moves on the slate's own form, in the episode's overview; the open items follow.
  const parts = producer.getByRole("navigation", { name: "Parts of the episode" });
  await parts.getByRole("link", { name: "Overview and dates" }).click();
  await producer.getByRole("button", { name: "Edit details" }).click();
  await producer.getByLabel("Target publish date").fill("2027-04-05");
  await producer.getByRole("button", { name: "Save changes" }).click();
  await expect(producer.getByRole("button", { name: "Edit details" })).toBeVisible();
  await parts.getByRole("link", { name: "Sponsor deals" }).click();
  // 5 April − 7 = 29 March; 5 April + 30 = 5 May.
  await expect(dueOf(producer, "draft_cut")).toHaveText("Mon 29 Mar 2027");
  await expect(dueOf(producer, "report")).toHaveText("Wed 5 May 2027");
  await snap(producer, "sponsors-05-dates-followed");

  // The read: a script with the disclosure, then a review link for the script approval.
  await deals.getByLabel("Script of the segment").fill("This video is sponsored by Halvard. Their supply holds 0.1 mV ripple. Shipping is free on orders over fifty euros at halvard.example/millrace with code MILLRACE10.");
  // 6 + 6 + 13 words (a link or a code counts as one word).
  await expect(deals.getByTestId("read-words")).toHaveText("25");
  // The read time shows its sum and how it is rounded; "fifty euros" says the point's "50 euros".
  await expect(deals.getByTestId("read-time-working")).toContainText(/25 words ÷ \d+ words a minute = [\d.]+\ss, rounded to the nearest second \(a half second rounds up\)/);
  await expect(deals.getByText("Talking points (2 of 2)")).toBeVisible();
  await deals.getByRole("button", { name: "Save the read" }).click();
  await expect(deals.getByText("Saved.")).toBeVisible();
  // Beside the read, where the disclosure is checked: the sources it follows, and that it is no legal advice.
  const guidance = deals.getByRole("complementary", { name: "Disclosure guidance" });
  await expect(guidance).toContainText("16 CFR Part 255");
  await expect(guidance).toContainText("CAP Code");
  await expect(guidance).toContainText("The law of the country where the video is seen governs");
  await deals.getByLabel("Item to review").selectOption({ label: "Sponsor approves the script" });
  await deals.getByRole("button", { name: "Send review link" }).click();
  await expect(deals.getByText(`Review link e-mailed to Rosa Lindgren <${contactEmail}>`)).toBeVisible();
  await snap(producer, "sponsors-06-review-link-sent");

  // The sponsor's contact opens the e-mailed link in a private window, without an account.
  const invite = await latestMailTo(contactEmail);
  const link = invite.text.match(/https?:\/\/\S+\/review\/\S+/)![0];
  const sponsorContext = await browser.newContext();
  const sponsor = await sponsorContext.newPage();
  await sponsor.goto(link);
  await expect(sponsor.getByRole("heading", { name: "Review: Sponsor approves the script" })).toBeVisible();
  await expect(sponsor.getByText("Their supply holds 0.1 mV ripple")).toBeVisible();
  await expect(sponsor.getByText("2,750")).toHaveCount(0);
  await sponsor.getByLabel("Ask for changes").check();
  await sponsor.getByRole("button", { name: "Send decision" }).click();
  await expect(sponsor.getByText("Say what should change.")).toBeVisible();
  await sponsor.getByLabel("Comment").fill("Please mention the three-year warranty.");
  await snap(sponsor, "sponsors-07-sponsor-review");
  await sponsor.getByRole("button", { name: "Send decision" }).click();
  await expect(sponsor.getByText("your decision is recorded")).toBeVisible();
  await sponsor.reload();
  await expect(sponsor.getByText("your decision is recorded")).toBeVisible();
  await snap(sponsor, "sponsors-08-sponsor-decided");
  await sponsorContext.close();

  // The producer sees the status change and gets the e-mail at the mail stand-in.
  await producer.reload();
  await expect(producer.getByLabel("Status of Sponsor approves the script")).toHaveValue("changes_asked");
  await expect(deals.getByTestId("review-link").first()).toContainText("Please mention the three-year warranty.");
  const told = await latestMailTo(producerPerson.email);
  expect(told.subject).toBe('Rosa Lindgren of Halvard Power Supplies asked for changes to "Sponsor approves the script"');
  expect(told.text).toContain("Please mention the three-year warranty.");
  await snap(producer, "sponsors-09-changes-asked");

  // The editor opens the same deal: length, talking points, link and code; no fee, on the page or from the API.
  const editor = await signIn(browser, editorPerson.email);
  await editor.goto(`/c/${channelId}/episodes/${episodeId}/sponsor-deals`);
  const editorDeals = editor.locator("#sponsor-deals");
  await expect(editorDeals.getByTestId("segment-length")).toContainText("60 s");
  await expect(editorDeals.getByTestId("talking-points")).toContainText("Holds 0.1 mV ripple");
  await expect(editorDeals.getByTestId("segment-link")).toHaveText("https://halvard.example/millrace");
  await expect(editorDeals.getByTestId("segment-code")).toHaveText("MILLRACE10");
  await expect(editorDeals.getByTestId("deal-fee")).toHaveCount(0);
  await expect(editorDeals.getByText("2,750")).toHaveCount(0);
  await expect(editorDeals.getByText("Invoice the sponsor")).toHaveCount(0);
  await snap(editor, "sponsors-10-editor-no-fee");
  const answer = await editor.request.get(`/api/channels/${channelId}/episodes/${episodeId}/deals`);
  expect(answer.status()).toBe(200);
  const text = await answer.text();
  expect(text).toContain("MILLRACE10");
  expect(text).not.toMatch(/"money"|"fee"|paymentTerms|2750|"kind":"invoice"/);
});
