import path from "node:path";
import { expect, type Browser, type Page } from "@playwright/test";
import pg from "pg";
import { DEMO_CHANNEL, DEMO_PASSWORD, demoAccounts, seedDemo } from "../../dev-services/demo/channel";
import { connectDatabase } from "../../server/db/client";
import type { Role } from "../../shared/access/roles";
import { factoryPasswordHash } from "../factories/accounts";
import type { EpisodeRecord } from "../../shared/slate/schemas";
import type { Stage } from "../../shared/slate/stages";

const shots = path.resolve(import.meta.dirname, "../../.kerf/test-output/screenshots");

/** Saves what the person sees at this step, kept as a test artifact. */
export async function snap(page: Page, name: string): Promise<void> {
  await page.screenshot({ path: path.join(shots, `${name}.png`), fullPage: true });
}

/** A phone held upright (390 × 844 CSS pixels), the size every page must fit without sideways scrolling. */
export const PHONE = { width: 390, height: 844 };
export const DESK = { width: 1280, height: 800 };

/** What a page shows that does not fit a narrow screen: read in the page, so the report names each culprit. */
function misfitsOnPage(): string[] {
  const doc = document.documentElement;
  const width = doc.clientWidth;
  const found: string[] = [];
  if (doc.scrollWidth > width) found.push(`the page scrolls sideways: ${doc.scrollWidth} px wide in ${width} px`);
  const name = (el: Element) => (el.getAttribute("aria-label") ?? el.textContent ?? "").trim().replace(/\s+/g, " ").slice(0, 60) || el.outerHTML.slice(0, 80);
  // A box the person can scroll sideways (a wide table) may hold a button out of view; it is not cut.
  const inSideScroller = (el: Element) => {
    for (let up = el.parentElement; up && up !== doc; up = up.parentElement) {
      const overflow = getComputedStyle(up).overflowX;
      if ((overflow === "auto" || overflow === "scroll") && up.scrollWidth > up.clientWidth) return true;
    }
    return false;
  };
  for (const el of document.querySelectorAll("button, [role=button], a[class*='rounded-md']")) {
    const box = el.getBoundingClientRect();
    const style = getComputedStyle(el);
    if (box.width === 0 || box.height === 0 || style.visibility === "hidden" || el.closest("[aria-hidden=true], .sr-only")) continue;
    if (el.scrollWidth > el.clientWidth + 1) found.push(`the label of “${name(el)}” is cut: ${el.scrollWidth} px in ${el.clientWidth} px`);
    if ((box.left < -1 || box.right > width + 1) && !inSideScroller(el)) found.push(`“${name(el)}” reaches past the screen: ${Math.round(box.left)}–${Math.round(box.right)} px of ${width} px`);
  }
  return found;
}

/** Fails when the page scrolls sideways, or a visible button's label is cut or reaches past the screen's edge. */
export async function expectFitsPhone(page: Page, label: string): Promise<void> {
  expect(await page.evaluate(misfitsOnPage), `${label}: what does not fit a ${page.viewportSize()?.width ?? "?"} px screen`).toEqual([]);
}

export function uniqueEmail(label: string): string {
  return `${label}-${Date.now().toString(36)}${Math.random().toString(36).slice(2, 6)}@example.com`;
}

interface CaughtMail {
  text: string;
  subject: string;
  to: { address: string }[];
}

/** How often a test asks the mail stand-in: its workers send within about half a second, so every quarter to half a second, not Playwright's default second. */
export const MAIL_POLL_INTERVALS = [100, 250, 250, 500];

/** Waits until the mail stand-in holds a message to `address`, and answers the newest one. */
export async function latestMailTo(address: string, timeoutMs = 15_000): Promise<{ text: string; subject: string }> {
  let mine: CaughtMail[] = [];
  await expect
    .poll(
      async () => {
        const all = (await (await fetch(`${process.env.KERF_TEST_MAIL_WEB_URL}/api/email`)).json()) as CaughtMail[];
        mine = all.filter((m) => m.to.some((t) => t.address === address));
        return mine.length;
      },
      { timeout: timeoutMs, intervals: MAIL_POLL_INTERVALS, message: `mail to ${address}` },
    )
    .toBeGreaterThan(0);
  return mine[mine.length - 1]!;
}

export const PASSWORD = "a-long-enough-password";

/** A query straight against the test database, for what no page or route makes. */
export async function sql<T extends pg.QueryResultRow>(text: string, values: unknown[]): Promise<T[]> {
  const client = new pg.Client({ connectionString: process.env.KERF_E2E_DATABASE_URL });
  await client.connect();
  try {
    return (await client.query<T>(text, values)).rows;
  } finally {
    await client.end();
  }
}

/** Where every sign-in lands: the member's home. */
export async function expectHome(page: Page): Promise<void> {
  await expect(page.getByRole("heading", { name: "What needs you" })).toBeVisible();
}

/**
 * The demo channel's id. The demo is made once in the browser tests' database (its accounts are fixed
 * addresses, so a second run finds it there). Two test workers may ask at once: the first takes a lock
 * and makes it, the other waits on the lock and then finds it made.
 */
export async function demoChannelId(): Promise<string> {
  const client = new pg.Client({ connectionString: process.env.KERF_E2E_DATABASE_URL });
  await client.connect();
  try {
    // Held until this session ends, whatever happens in between.
    await client.query("select pg_advisory_lock(hashtext('browser tests: the demo channel'))");
    const found = async () => (await client.query<{ id: string }>("select id from channels where name = $1", [DEMO_CHANNEL])).rows;
    if ((await found()).length === 0) {
      const handle = connectDatabase(process.env.KERF_E2E_DATABASE_URL!);
      try {
        await seedDemo(handle.db);
      } finally {
        await handle.close();
      }
    }
    return (await found())[0]!.id;
  } finally {
    await client.end();
  }
}

/**
 * Signs in through the sign-in route, as the sign-in page sends it, for journeys that do not test that
 * page (accounts.spec.ts and sign-in-next.spec.ts do): the session cookie lands in the page's context.
 * Answers the person's channels; the page itself is left where it was.
 */
function signInThroughApi(page: Page, email: string, password: string): Promise<Me> {
  return visitorPost(page, "/api/auth/sign-in", { email, password }, 200);
}

type Me = { csrfToken: string; memberships: { channelId: string }[] };

/** A signed-out visitor's write as a page sends it, with the CSRF token of /api/auth/me; a refusal fails the test. */
async function visitorPost(page: Page, url: string, data: object, status: number): Promise<Me> {
  const visitor = (await (await page.request.get("/api/auth/me")).json()) as Me;
  const answer = await page.request.post(url, { headers: { "x-csrf-token": visitor.csrfToken }, data });
  expect(answer.status(), `${url}: ${await answer.text()}`).toBe(status);
  return answer.json();
}

/** Signs in as the demo channel's member in this role and opens that channel's home. */
export async function signInToDemo(page: Page, role: Role, channelId: string): Promise<void> {
  const account = demoAccounts.find((a) => a.role === role)!;
  await signInThroughApi(page, account.email, DEMO_PASSWORD);
  // The demo owner belongs to a second channel too; the demo channel's home is the one under test.
  await page.goto(`/c/${channelId}/home`);
  await expectHome(page);
}

/** From the home (where sign-in lands) to the slate, through the top bar (on a phone, through its menu). */
export async function homeToSlate(page: Page): Promise<void> {
  await expectHome(page);
  const menu = page.getByRole("button", { name: "Menu" });
  if (await menu.isVisible()) await menu.click();
  await page.getByRole("navigation", { name: "Channel pages" }).getByRole("link", { name: "Slate" }).click();
  await expect(page.getByRole("heading", { name: "Slate" })).toBeVisible();
}

/**
 * A new account and channel through the sign-up route, as the sign-up page sends it (this browser's
 * zone included), for journeys that do not test that page (accounts.spec.ts does). The
 * session cookie lands in the page's context as it would from the page; the address is confirmed.
 * Answers the new channel and the session's CSRF token; the page itself is left where it was.
 */
export async function signUpThroughApi(page: Page, person: { name: string; email: string; channel: string }): Promise<{ channelId: string; csrfToken: string }> {
  const timeZone = await page.evaluate(() => Intl.DateTimeFormat().resolvedOptions().timeZone);
  const me = await visitorPost(page, "/api/auth/sign-up", { name: person.name, email: person.email, password: PASSWORD, channelName: person.channel, timeZone }, 201);
  await sql("update users set email_verified_at = now() where email = $1", [person.email]);
  return { channelId: me.memberships[0]!.channelId, csrfToken: me.csrfToken };
}

/** A member in a role of their own with a confirmed address, made straight in the test database (the invitation journey has its own test). */
export async function member(channelId: string, name: string, role: "producer" | "editor" | "crew") {
  const email = uniqueEmail(role);
  const [user] = await sql<{ id: string }>("insert into users (email, name, password_hash, email_verified_at) values ($1, $2, $3, now()) returning id", [email, name, await factoryPasswordHash(PASSWORD)]);
  await sql("insert into memberships (channel_id, user_id, role) values ($1, $2, $3)", [channelId, user!.id, role]);
  return { email, name };
}

/** Signs in (through the route) on a page whose context holds nobody's session yet, and opens the slate of the person's channel. */
export async function signInOn(page: Page, email: string): Promise<Page> {
  const { memberships } = await signInThroughApi(page, email, PASSWORD);
  await page.goto(`/c/${memberships[0]!.channelId}/slate`);
  await expect(page.getByRole("heading", { name: "Slate" })).toBeVisible();
  return page;
}

/** A fresh browser context, signed in; answers its page on the slate. */
export async function signIn(browser: Browser, email: string): Promise<Page> {
  return signInOn(await (await browser.newContext()).newPage(), email);
}

export interface HostAndEpisode {
  host: { name: string; channel: string };
  episode: { title: string; question: string; origin: "idea" | "sponsor"; targetPublishDate?: string; stage: Stage };
}

/**
 * A new host with a channel (through the sign-up route) and one episode, made and moved to the asked
 * stage through the slate's API. A refusal fails the test: a journey must not start on a setup the
 * product would not have made. The page opens nothing: the journey goes to its own first address.
 */
export async function hostWithEpisode(page: Page, { host, episode }: HostAndEpisode) {
  const { channelId, csrfToken } = await signUpThroughApi(page, { ...host, email: uniqueEmail("host") });
  const headers = { "x-csrf-token": csrfToken };
  const created = await page.request.post(`/api/channels/${channelId}/episodes`, {
    headers,
    data: { title: episode.title, question: episode.question, origin: episode.origin, originLink: "", whyWorthIt: "", ownerId: "", tags: [], budgetAmount: "", budgetCurrency: "", targetPublishDate: episode.targetPublishDate ?? "" },
  });
  expect(created.status(), `creating the episode: ${await created.text()}`).toBe(201);
  let made = (await created.json()).episode as EpisodeRecord;
  if (made.stage !== episode.stage) {
    // Skipping stages asks for a reason; the setup gives one, as a person moving it on would.
    const moved = await page.request.post(`/api/channels/${channelId}/episodes/${made.id}/move`, {
      headers,
      data: { version: made.version, stage: episode.stage, reason: "Set up at this stage for the journey." },
    });
    expect(moved.status(), `moving the episode to ${episode.stage}: ${await moved.text()}`).toBe(200);
    made = (await moved.json()).episode as EpisodeRecord;
  }
  expect(made.stage).toBe(episode.stage);
  return { channelId, episodeId: made.id, csrfToken };
}

/** A channel's API as its signed-in member calls it: a refusal fails the test, naming the route and the server's answer. */
export function channelApi(page: Page, at: { channelId: string; csrfToken: string }) {
  return async (method: "post" | "put", url: string, data: object, status = 201) => {
    const answer = await page.request[method](`/api/channels/${at.channelId}${url}`, { headers: { "x-csrf-token": at.csrfToken }, data });
    expect(answer.status(), `${method.toUpperCase()} ${url}: ${await answer.text()}`).toBe(status);
    return answer.json();
  };
}

export interface SponsoredDeal {
  company: string;
  link: string;
  code: string;
  /** The sponsor's contact, who gets what is mailed to the sponsor; none when null. */
  contact: { name: string; email: string } | null;
  talkingPoints: string[];
  /** The days after go-live the deal asks for figures: one report item each. */
  figureDays: number[];
}

/** A signed, paid deal on the episode with its disclosure, link and code, a go-live item and a report item per figure day, through the sponsors' API. */
export async function sponsoredDeal(page: Page, at: { channelId: string; episodeId: string; csrfToken: string }, wanted: SponsoredDeal) {
  const send = channelApi(page, at);
  const { sponsor } = await send("post", "/sponsors", { company: wanted.company, website: null, notes: null });
  const contact = wanted.contact && (await send("post", `/sponsors/${sponsor.id}/contacts`, { ...wanted.contact, role: "Partnerships" })).contact;
  const { deal } = await send("post", "/deals", {
    episodeId: at.episodeId, sponsorId: sponsor.id, templateId: null, state: "signed", placement: "middle", segmentSeconds: 45, talkingPoints: wanted.talkingPoints,
    link: wanted.link, promoCode: wanted.code, disclosureText: `Paid partnership with ${wanted.company}.`, exclusivityNotes: null, descriptionCopy: null,
    script: [`This video is sponsored by ${wanted.company}.`, ...wanted.talkingPoints.map((p) => `${p}.`)].join(" "), contactId: contact?.id ?? null, hostId: null, goLiveDate: null,
    money: { fee: 900, currency: "EUR", paymentTermsDays: 30, paymentTermsFrom: "invoice", invoiceNumber: null, invoicedOn: null, paidOn: null },
  });
  await send("post", `/deals/${deal.id}/deliverables`, { kind: "go_live", title: "Video goes live", anchor: "after_go_live", offsetDays: 0 });
  for (const day of wanted.figureDays) await send("post", `/deals/${deal.id}/deliverables`, { kind: "report", title: `Figures at ${day} days`, anchor: "after_go_live", offsetDays: day });
  return { dealId: deal.id as string, contactId: (contact?.id ?? null) as string | null };
}

/** A sponsor, a contact, a one-item template and a deal on the episode, through the sponsors' API; answers the review link's address. */
export async function dealWithReviewLink(page: Page, channelId: string, episodeId: string, csrfToken: string): Promise<string> {
  const base = `/api/channels/${channelId}`;
  const post = async (url: string, data: object) => {
    const answer = await page.request.post(`${base}${url}`, { headers: { "x-csrf-token": csrfToken }, data });
    expect(answer.status(), `${url}: ${await answer.text()}`).toBe(201);
    return answer.json();
  };
  const { sponsor } = await post("/sponsors", { company: "Tarnvik Linear Rail", website: "https://tarnvik.example", notes: "" });
  const { contact } = await post(`/sponsors/${sponsor.id}/contacts`, { name: "Elin Sandqvist", email: uniqueEmail("a11y-contact"), role: "" });
  const { template } = await post("/deal-templates", {
    name: "Single read",
    items: [{ kind: "script_approval", title: "Sponsor approves the script", anchor: "before_publish", offsetDays: 14, ownerRole: null }],
  });
  const { deal } = await post("/deals", {
    episodeId,
    sponsorId: sponsor.id,
    templateId: template.id,
    state: "signed",
    placement: "middle",
    segmentSeconds: 60,
    talkingPoints: ["Carriages roll on sealed bearings"],
    link: "https://tarnvik.example/offcut",
    promoCode: "OFFCUT15",
    disclosureText: null,
    exclusivityNotes: null,
    descriptionCopy: null,
    script: "This video is sponsored by Tarnvik. Their carriages roll on sealed bearings; use code OFFCUT15 at tarnvik.example/offcut.",
    contactId: contact.id,
    hostId: null,
    goLiveDate: null,
    money: { fee: 1200, currency: "EUR", paymentTermsDays: 30, paymentTermsFrom: "go_live", invoiceNumber: null, invoicedOn: null, paidOn: null },
  });
  const { url } = await post(`/deals/${deal.id}/review-links`, { deliverableId: deal.deliverables[0].id, contactId: contact.id });
  return url as string;
}

/** A signed deal on the episode with a fee of EUR 1,800.50 at 30 days from invoice, its sponsor and payables contact made through the API. */
export async function signedEuroDeal(page: Page, at: { channelId: string; episodeId: string; csrfToken: string }, names: { company: string; contact: string }) {
  const post = async (url: string, data: object) => {
    const answer = await page.request.post(`/api/channels/${at.channelId}${url}`, { headers: { "x-csrf-token": at.csrfToken }, data });
    expect(answer.status(), `${url}: ${await answer.text()}`).toBe(201);
    return answer.json();
  };
  const { sponsor } = await post("/sponsors", { company: names.company, website: "", notes: "" });
  const { contact } = await post(`/sponsors/${sponsor.id}/contacts`, { name: names.contact, email: uniqueEmail("payables"), role: "Accounts" });
  await post("/deals", {
    episodeId: at.episodeId,
    sponsorId: sponsor.id,
    templateId: null,
    state: "signed",
    placement: "middle",
    segmentSeconds: 60,
    talkingPoints: [],
    link: null,
    promoCode: null,
    disclosureText: null,
    exclusivityNotes: null,
    descriptionCopy: null,
    script: "",
    contactId: contact.id,
    hostId: null,
    goLiveDate: null,
    money: { fee: "1,800.50", currency: "EUR", paymentTermsDays: 30, paymentTermsFrom: "invoice", invoiceNumber: null, invoicedOn: null, paidOn: null },
  });
}
