import { readFile, writeFile } from "node:fs/promises";
import path from "node:path";
import { expect, test, type Page } from "@playwright/test";
import { PDFDocument } from "pdf-lib";
import { formatFigure } from "../../shared/publish/figures";
import { reportTokens } from "../../server/sponsors/review-token";
import { expectNoSeriousA11yViolations } from "./axe";
import { channelApi, DESK, expectFitsPhone, hostWithEpisode, latestMailTo, member, PHONE, signIn, snap, sponsoredDeal, sql, uniqueEmail } from "./support";

test.setTimeout(300_000);

const pdfOut = path.resolve(import.meta.dirname, "../../.kerf/test-output/sponsor-report.pdf");
const figures = {
  7: { Views: "12400", "Watch time (hours)": "610.5", "Link clicks": "318", "Code uses": "41" },
  30: { Views: "40125", "Watch time (hours)": "2210", "Link clicks": "1045", "Code uses": "163" },
};

/** Enters one agreed day's figures by hand in the publish part's figures form, as the producer would. */
async function enterFigures(page: Page, day: 7 | 30) {
  const part = page.locator("#figures-heading").locator("..");
  await part.getByRole("combobox", { name: "Figures of" }).selectOption(String(day));
  const form = part.getByRole("form", { name: `Figures of day ${day}` });
  for (const [label, value] of Object.entries(figures[day])) await form.getByLabel(label, { exact: true }).fill(value);
  await form.getByRole("button", { name: `Save day ${day}` }).click();
  await expect(part.getByRole("row", { name: new RegExp(`^Day ${day}\\b`) }).getByRole("cell").first()).toHaveText(formatFigure(Number(figures[day].Views)));
}

/** What the sponsor's page must show: the items and their dates, the segment, the disclosure as published, and the figures with their chart. */
async function expectTheReport(page: Page) {
  await expect(page.getByRole("heading", { level: 1, name: "Three cells, one long night" })).toBeVisible({ timeout: 30_000 });
  await expect(page.getByText("Fee (members only")).toHaveCount(0);
  await expect(page.getByRole("listitem").filter({ hasText: "Figures at 30 days" })).toContainText("Done");
  await expect(page.getByRole("listitem").filter({ hasText: "Video goes live" })).toContainText("Done");
  await expect(page.getByText(/^not measured in the cut against .+ agreed$/)).toBeVisible();
  await expect(page.getByText("✓ Covered: Cells are graded in matched sets")).toBeVisible();
  await expect(page.locator("blockquote")).toHaveText("Paid partnership with Ohmwright Cells.");
  await expect(page.getByRole("row", { name: /^Day 30\b/ })).toContainText(formatFigure(40125));
  await expect(page.locator("[data-figure-chart] svg.recharts-surface")).toHaveCount(4);
}

test("after go-live the producer enters the figures, makes the sponsor's report PDF and mails it; the contact opens it signed out", async ({ page, browser }) => {
  const { channelId, episodeId, csrfToken } = await hostWithEpisode(page, {
    host: { name: "Maren Ostrova", channel: "Lantern Cell Lab" },
    episode: { title: "Three cells, one long night", question: "Which cell keeps 2 A longest?", origin: "sponsor", stage: "publish", targetPublishDate: "2026-11-02" },
  });
  const contact = { name: "Tobiah Wren", email: uniqueEmail("sponsor-contact") };
  const { dealId } = await sponsoredDeal(page, { channelId, episodeId, csrfToken }, {
    company: "Ohmwright Cells", link: "https://ohmwright.example/night", code: "LANTERN12", contact, talkingPoints: ["Cells are graded in matched sets"], figureDays: [7, 30],
  });
  // The package and go-live have their own journey (publish.spec.ts); here they are made through the API.
  const send = channelApi(page, { channelId, csrfToken });
  const publish = `/episodes/${episodeId}/publish`;
  await send("put", publish, {
    version: 0, titles: ["Three cells, one long night"], chosenTitle: 0, chapters: "", timeZone: "UTC", publishAt: null, thumbnailId: null,
    description: "Paid partnership with Ohmwright Cells.\nWhich cell keeps 2 A longest?\nOhmwright Cells: https://ohmwright.example/night (code LANTERN12)",
  }, 200);
  await send("post", `${publish}/go-live`, { videoUrl: "https://video.example/watch/lantern-7", publishedAt: "2026-11-02T15:00:00Z", reason: "No thumbnail in this journey." }, 200);

  const { email } = await member(channelId, "Priya Castellane", "producer");
  const producer = await signIn(browser, email);
  await producer.goto(`/c/${channelId}/episodes/${episodeId}/publish-package`);
  await expect(producer.locator("#figures-heading")).toBeVisible({ timeout: 60_000 });
  await enterFigures(producer, 7);
  await enterFigures(producer, 30);

  await producer.getByRole("navigation", { name: "Parts of the episode" }).getByRole("link", { name: "Sponsor deals" }).click();
  await producer.locator("#sponsor-deals").getByRole("link", { name: "The sponsor's report" }).click();
  await expect(producer.getByRole("heading", { name: "The sponsor's report" })).toBeVisible();
  // The figures items are what this report delivers: until it is sent, the report (and its PDF) says so rather than "not started".
  await expect(producer.getByRole("listitem").filter({ hasText: "Figures at 30 days" })).toContainText("in this report");
  await producer.getByRole("button", { name: "Make the PDF" }).click();
  // The job prints the sponsor's page in Chromium; the page looks again until the job has finished.
  await expect(producer.getByRole("status").filter({ hasText: /^PDF ready: \d+ pages?/ })).toBeVisible({ timeout: 120_000 });
  const [made] = await sql<{ id: string; state: string; pages: number; size_bytes: number }>("select id, state, pages, size_bytes::int as size_bytes from sponsor_reports where deal_id = $1", [dealId]);
  expect(made).toMatchObject({ state: "ready" });

  const [download] = await Promise.all([producer.waitForEvent("download"), producer.getByRole("link", { name: "Download the PDF" }).click()]);
  const pdf = await readFile(await download.path());
  await writeFile(pdfOut, pdf);
  expect(pdf.subarray(0, 5).toString("latin1")).toBe("%PDF-");
  const pages = (await PDFDocument.load(pdf)).getPageCount();
  expect(pages).toBeGreaterThanOrEqual(1);
  expect({ pages, bytes: pdf.length }).toEqual({ pages: made!.pages, bytes: made!.size_bytes });

  await producer.getByRole("button", { name: "Mail it to the sponsor's contact" }).click();
  await expect(producer.getByText(`Sent to ${contact.email}`)).toBeVisible();
  await snap(producer, "publish-report-01-sent");
  // Sending settled the report items: the deal's card shows them done.
  await producer.goBack();
  await expect(producer.getByLabel("Status of Figures at 30 days")).toHaveValue("done");

  const mail = await latestMailTo(contact.email, 60_000);
  expect(mail.subject).toContain("Ohmwright Cells");
  const link = /https?:\/\/\S+\/sponsor-report\/\S+/.exec(mail.text)![0];

  const sponsor = await (await browser.newContext({ viewport: DESK })).newPage();
  await sponsor.goto(link);
  await expectTheReport(sponsor);
  await expect(sponsor.getByRole("link", { name: "Download the report as PDF" })).toBeVisible();
  await snap(sponsor, "publish-report-02-sponsor-desk");
  await expectNoSeriousA11yViolations(sponsor, "the sponsor's report");
  await sponsor.setViewportSize(PHONE);
  await snap(sponsor, "publish-report-03-sponsor-phone");
  await expectFitsPhone(sponsor, "the sponsor's report");

  // A forged token, and a genuine one whose time is up, open no report: the page says so in plain words.
  const token = link.split("/sponsor-report/")[1]!;
  const expired = reportTokens(process.env.KERF_E2E_SESSION_SECRET!).link.sign(made!.id, new Date(Date.now() - 60_000));
  const wrongs = [
    { token: `${token.slice(0, -2)}xx`, status: 404, why: "Check that the whole address was copied" },
    { token: expired, status: 410, why: "This report link has expired." },
  ];
  for (const wrong of wrongs) {
    const answer = sponsor.waitForResponse((r) => r.url().includes("/api/sponsor-report/"));
    await sponsor.goto(`/sponsor-report/${wrong.token}`);
    expect((await answer).status()).toBe(wrong.status);
    await expect(sponsor.getByText("This report link doesn't open")).toBeVisible();
    await expect(sponsor.getByText(wrong.why)).toBeVisible();
    await expect(sponsor.getByText("Ohmwright Cells")).toHaveCount(0);
  }
});
