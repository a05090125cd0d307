import { expect, test, type Page } from "@playwright/test";
import { expectNoSeriousA11yViolations } from "./axe";
import { hostWithEpisode, snap } from "./support";

const q = (value: number, unit: string) => ({ value, unit });

/** A criterion, a run, an iteration, a shoot day and a shot, through the API as the host, so each part has something in it. */
async function fillThroughApi(page: Page, channelId: string, episodeId: string, csrfToken: string) {
  const post = async (url: string, data: unknown) => {
    const response = await page.request.post(url, { headers: { "x-csrf-token": csrfToken }, data });
    expect(response.status(), `${url}: ${await response.text()}`).toBe(201);
    return response.json();
  };
  const episode = `/api/channels/${channelId}/episodes/${episodeId}`;
  await post(`${episode}/test-plan/criteria`, { metric: "thrust", comparator: "gte", threshold: q(3.5, "N"), required: true });
  await post(`${episode}/bench-runs`, { label: "Alder 2207 on 4S", parts: [], supply: { kind: "lipo", cells: 4 }, measurements: { thrust: q(610, "gf"), voltage: q(15.6, "V"), current: q(9.5, "A") }, notes: "" });
  await post(`${episode}/build-log`, { change: "Birch ply arms, 3 mm", allUpMass: q(410, "g"), outcome: "partly", chosenRunId: null, notes: "" });
  await post(`${episode}/shoot-days`, { day: "2027-02-13", place: "Workshop bench", callTime: "08:30" });
  await post(`${episode}/shots`, { description: "Close-up of the arm flexing under full throttle", kind: "build_closeup" });
}

/** What reaches past the window's edge: nothing when the page does not scroll sideways. */
function pastTheEdge(): string[] {
  const client = document.documentElement.clientWidth;
  if (document.documentElement.scrollWidth <= client) return [];
  const past = [...document.querySelectorAll<HTMLElement>("main *")]
    .filter((element) => element.getBoundingClientRect().right > client + 0.5 && element.children.length === 0)
    .slice(0, 5)
    .map((element) => `${element.tagName.toLowerCase()}${element.id ? `#${element.id}` : ""} "${(element.textContent ?? "").trim().slice(0, 30)}"`);
  return [`the page is ${document.documentElement.scrollWidth} px wide in a ${client} px window`, ...past];
}

/**
 * The page settles with no sideways scroll; a failure names the elements past the window's edge. Read
 * until it holds, so a part still laying itself out is not judged half-drawn.
 */
async function expectNoSidewaysScroll(page: Page, label: string) {
  await expect.poll(() => page.evaluate(pastTheEdge), { message: `${label}: what reaches past the window's edge` }).toEqual([]);
}

test.use({ viewport: { width: 1280, height: 800 } });

const rail = (page: Page) => page.getByRole("navigation", { name: "Parts of the episode" });

test("an episode in Build opens on its bench runs, the rail switches parts in the address, and a link lands on its part", async ({ page }) => {
  test.setTimeout(180_000);
  const { channelId, episodeId, csrfToken } = await hostWithEpisode(page, {
    host: { name: "Maren Sollie", channel: "Birch Arm Aerial Works" },
    episode: { title: "Do ply arms flex less than printed ones?", question: "Which arm bends less at full throttle?", origin: "idea", stage: "build" },
  });
  await fillThroughApi(page, channelId, episodeId, csrfToken);
  const base = `/c/${channelId}/episodes/${episodeId}`;

  // An address without a part opens the stage's own, and then says so.
  await page.goto(base);
  await expect(page).toHaveURL(`${base}/bench`, { timeout: 30_000 });
  await expect(page.getByRole("heading", { level: 2, name: "Bench runs" })).toBeVisible();
  await expect(page.getByRole("listitem", { name: "Run 1: Alder 2207 on 4S" })).toBeVisible();
  await expect(rail(page).getByRole("link", { name: /Bench runs/ })).toHaveAttribute("aria-current", "page");
  await expect(page.getByRole("heading", { level: 2, name: "Build log" })).toHaveCount(0);
  await snap(page, "episode-parts-01-build-opens-on-bench");
  await expectNoSeriousA11yViolations(page, "episode page, bench runs");

  // The rail switches the part and the address follows; the browser's back button returns.
  await rail(page).getByRole("link", { name: "Build log" }).click();
  await expect(page).toHaveURL(`${base}/build-log`);
  await expect(page.getByRole("listitem", { name: "Iteration 1" })).toBeVisible();
  await page.goBack();
  await expect(page).toHaveURL(`${base}/bench`);
  await expect(page.getByRole("listitem", { name: "Run 1: Alder 2207 on 4S" })).toBeVisible();

  // The add form opens from its button with the focus inside; Escape closes it and the focus goes back.
  const open = page.getByRole("button", { name: "Enter a bench run" });
  await open.click();
  const form = page.getByRole("form", { name: "New bench run" });
  await expect(form).toBeVisible();
  await expect(form.locator(":focus")).toHaveCount(1);
  await snap(page, "episode-parts-02-add-run-open");
  await page.keyboard.press("Escape");
  await expect(form).toHaveCount(0);
  await expect(open).toBeFocused();

  // A link with a part lands on it; an old link to a section lands on the part that holds it now.
  await page.goto(`${base}/history`);
  await expect(page.getByRole("heading", { level: 2, name: "History" })).toBeVisible({ timeout: 30_000 });
  await page.goto(`${base}#shoot-footage`);
  await expect(page).toHaveURL(`${base}/shoot`, { timeout: 30_000 });
  await expect(page.getByRole("link", { name: "Sat 13 Feb 2027 · Workshop bench" })).toBeVisible();
  await page.goto(`${base}/no-such-part`);
  await expect(page).toHaveURL(`${base}/bench`, { timeout: 30_000 });
});

test("at phone size every part of the episode fits the screen, with the parts in a strip that stays in view", async ({ page }) => {
  test.setTimeout(240_000);
  const { channelId, episodeId, csrfToken } = await hostWithEpisode(page, {
    host: { name: "Lauri Kettunen", channel: "Kettle Hill Workshop" },
    episode: { title: "Can a 3 mm birch arm survive a 2207 at full throttle?", question: "Does the arm crack before the motor stalls?", origin: "idea", stage: "shoot", targetPublishDate: "2027-04-02" },
  });
  await fillThroughApi(page, channelId, episodeId, csrfToken);
  const base = `/c/${channelId}/episodes/${episodeId}`;
  await page.setViewportSize({ width: 390, height: 844 });

  await page.goto(base);
  await expect(page).toHaveURL(`${base}/shoot`, { timeout: 30_000 });
  const partIds = await rail(page)
    .getByRole("link")
    .evaluateAll((links) => links.map((link) => link.getAttribute("href")?.split("/").pop() ?? ""));
  expect(partIds).toEqual(["overview", "test-plan", "bench", "build-log", "shoot", "footage", "sponsor-deals", "publish-package", "money", "history", "comments"]);

  for (const part of partIds) {
    await rail(page).locator(`a[href$="/${part}"]`).click();
    await expect(page).toHaveURL(`${base}/${part}`);
    await expect(page.locator(`section#${part}`)).toBeVisible();
    // The part's code ("Opening …") and its answers ("Loading …") have come.
    await expect(page.locator(`section#${part}`).getByText(/^(Opening|Loading)/)).toHaveCount(0);
    await expectNoSidewaysScroll(page, part);
    await snap(page, `episode-parts-phone-${part}`);
  }

  // Far down a long part, the strip is still on screen.
  await rail(page).getByRole("link", { name: "Bench runs" }).click();
  await page.getByRole("button", { name: "Enter a bench run" }).click();
  const form = page.getByRole("form", { name: "New bench run" });
  await expect(form.locator(":focus")).toHaveCount(1);
  await page.getByRole("button", { name: "Save run" }).scrollIntoViewIfNeeded();
  await expect(rail(page)).toBeInViewport();
  await expectNoSidewaysScroll(page, "bench with the run form open");
  await expectNoSeriousA11yViolations(page, "episode page at phone size");
});
