import { readFile } from "node:fs/promises";
import { expect, test, type Page } from "@playwright/test";
import { expectNoSeriousA11yViolations } from "./axe";
import { hostWithEpisode, snap } from "./support";

const q = (value: number, unit: string) => ({ value, unit });

/** Two criteria and three runs through the API, as the host. */
async function benchThroughApi(page: Page, channelId: string, episodeId: string, csrfToken: string) {
  const headers = { "x-csrf-token": csrfToken };
  const episode = `/api/channels/${channelId}/episodes/${episodeId}`;
  const post = async (url: string, data: unknown) => {
    const response = await page.request.post(url, { headers, data });
    expect(response.status(), `${url}: ${await response.text()}`).toBe(201);
  };
  await post(`${episode}/test-plan/criteria`, { metric: "thrust_per_watt", comparator: "gte", threshold: q(5, "gf/W"), required: true });
  await post(`${episode}/test-plan/criteria`, { metric: "thrust", comparator: "gte", threshold: q(4, "N"), required: true });
  const run = (label: string, measurements: object) => post(`${episode}/bench-runs`, { label, parts: [], supply: { kind: "lipo", cells: 3 }, measurements, notes: "" });
  // Own arithmetic: 11.1 V × 8.2 A = 91.02 W and 380 gf / 91.02 W = 4.17 gf/W; 11.1 V × 9.8 A = 108.78 W
  // and 760 gf / 108.78 W = 6.99 gf/W; 760 gf = 7.45 N (NIST SP 811 (2008), B.8: 1 gf = 0.00980665 N).
  await run("Alder on 3S", { mass: q(57, "g"), voltage: q(11.1, "V"), current: q(8200, "mA"), thrust: q(380, "gf") });
  await run("Birch on 3S", { mass: q(2.4, "oz"), voltage: q(11.1, "V"), current: q(9.8, "A"), thrust: q(760, "gf") });
  await run("Cedar on 3S", { mass: q(90, "g"), voltage: q(11.1, "V"), current: q(12, "A") });
}

/** Width and height from a PNG's IHDR chunk: bytes 16–23, big-endian (PNG specification, 3rd ed., 11.2.2 IHDR). */
const pngSize = (bytes: Buffer) => ({ signature: bytes.subarray(1, 4).toString("ascii"), width: bytes.readUInt32BE(16), height: bytes.readUInt32BE(20) });

test("the bench chart is drawn by the chart library, and the host draws the results card and downloads it", async ({ page }) => {
  test.setTimeout(180_000);
  const { channelId, episodeId, csrfToken } = await hostWithEpisode(page, {
    host: { name: "Oda Lindqvist", channel: "Slipway Thrust Bench" },
    episode: { title: "Which motor lifts the slipway frame?", question: "Alder, Birch or Cedar?", origin: "idea", stage: "test_plan" },
  });
  await benchThroughApi(page, channelId, episodeId, csrfToken);
  await page.goto(`/c/${channelId}/episodes/${episodeId}/bench`);

  // The chart: the library's drawing inside one named picture, the best run ringed and named.
  const chart = page.getByRole("img", { name: "Thrust per watt against mass, one point per run" });
  await expect(chart.locator("svg.recharts-surface")).toBeVisible({ timeout: 30_000 });
  await expect(chart.getByText("Best: run 2")).toBeVisible();
  await expect(chart.getByText("plan ≥ 5 gf/W")).toBeVisible();
  await expect(chart.getByText("Thrust per watt (gf/W)")).toBeVisible();

  // No card yet; drawing one shows its state until the job has recorded it ready.
  const card = page.getByRole("region", { name: "Results card for the edit" });
  await expect(card.getByText("No card yet: draw one when the runs are in.")).toBeVisible();
  await card.getByRole("button", { name: "Draw the results card" }).click();
  await expect(card.getByRole("status")).toHaveText("Ready.", { timeout: 60_000 });
  await expect(card.getByRole("img", { name: "The results card" })).toBeVisible();
  await card.scrollIntoViewIfNeeded();
  await snap(page, "bench-card-01-ready-desk");
  await expectNoSeriousA11yViolations(page, "bench with the results card");

  const [pngDownload] = await Promise.all([page.waitForEvent("download"), card.getByRole("link", { name: "Download the card as PNG" }).click()]);
  expect(pngDownload.suggestedFilename()).toBe("results-card-which-motor-lifts-the-slipway-frame.png");
  expect(pngSize(await readFile((await pngDownload.path())!))).toEqual({ signature: "PNG", width: 1920, height: 1080 });

  // The card's figures are the table's, cell for cell.
  const [svgDownload] = await Promise.all([page.waitForEvent("download"), card.getByRole("link", { name: "Download the card as SVG" }).click()]);
  const svg = await readFile((await svgDownload.path())!, "utf8");
  for (const figure of ["Thrust per watt", "Thrust"]) {
    const row = page.getByRole("row").filter({ has: page.getByRole("rowheader", { name: new RegExp(`^${figure}\\b`) }) }).first();
    const cells = await row.getByRole("cell").allInnerTexts();
    expect(cells.length).toBe(3);
    for (const cell of cells) expect(svg).toContain(`>${cell.trim()}</text>`);
  }
  expect(svg).toContain(">6.99</text>");
  expect(svg).toContain(">7.45</text>");

  await page.setViewportSize({ width: 390, height: 844 });
  await card.scrollIntoViewIfNeeded();
  expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
  await snap(page, "bench-card-02-phone");
});
