import path from "node:path";
import { expect, test, type Page } from "@playwright/test";
import { hostWithEpisode, snap } from "./support";

// A 160×120 test-card JPEG (5 KB), made with:
//   ffmpeg -f lavfi -i "testsrc=size=160x120:rate=1" -frames:v 1 -q:v 6 build-photo.jpg
const photo = path.resolve(import.meta.dirname, "../fixtures/bench/build-photo.jpg");

const q = (value: number, unit: string) => ({ value, unit });

/** Shelf parts, a criterion, a run and an iteration, all through the API as the host. */
async function benchThroughApi(page: Page, channelId: string, episodeId: string, csrfToken: string) {
  const headers = { "x-csrf-token": csrfToken };
  const post = async (url: string, data: unknown) => {
    const response = await page.request.post(url, { headers, data });
    expect(response.status(), `${url}: ${await response.text()}`).toBe(201);
    return response.json();
  };
  const parts = `/api/channels/${channelId}/bench/parts`;
  const blank = { ratedCurrent: null, price: null, supplier: "", notes: "" };
  const motor = (await post(parts, { name: "Rowan 2306 motor", kind: "motor", mass: q(1.1, "oz"), ratedVoltage: q(16.8, "V"), ...blank })).part;
  await post(parts, { name: "Hazel 5-inch prop", kind: "propeller", powered: false, mass: q(4.5, "g"), ratedVoltage: null, ...blank, supplier: "Mill Lane Models" });
  await post(parts, { name: "Spruce frame", kind: "frame", powered: false, mass: q(0.12, "kg"), ratedVoltage: null, ...blank });
  const episode = `/api/channels/${channelId}/episodes/${episodeId}`;
  await post(`${episode}/test-plan/criteria`, { metric: "thrust", comparator: "gte", threshold: q(3.5, "N"), required: true });
  await post(`${episode}/bench-runs`, { label: "Rowan on 4S", parts: [{ partId: motor.id, count: 1 }], supply: { kind: "lipo", cells: 4 }, measurements: { thrust: q(400, "gf"), voltage: q(15.8, "V"), current: q(4, "A") }, notes: "" });
  await post(`${episode}/build-log`, { change: "Spruce frame with the Rowan motor", allUpMass: q(350, "g"), outcome: "worked", chosenRunId: null, notes: "" });
}

test("the host reads a criterion against its run, switches a unit, finds a part and adds a photo to an iteration", async ({ page }) => {
  test.setTimeout(90_000);
  const { channelId, episodeId, csrfToken } = await hostWithEpisode(page, {
    host: { name: "Ines Varga", channel: "Tannery Yard Rotors" },
    episode: { title: "Does the 2306 lift the spruce frame?", question: "Is 400 gf enough for the frame?", origin: "idea", stage: "test_plan" },
  });
  await benchThroughApi(page, channelId, episodeId, csrfToken);

  // The run card reads the criterion in its own unit: 400 gf = 3.92 N (NIST SP 811 (2008), B.8: 1 gf = 0.00980665 N).
  await page.goto(`/c/${channelId}/episodes/${episodeId}/bench`);
  const run = page.getByRole("listitem", { name: "Run 1: Rowan on 4S" });
  // The episode page's first visit fetches its sections' code: on a busy machine that can take a while.
  await expect(run).toBeVisible({ timeout: 30_000 });
  const line = run.getByRole("list", { name: "Criteria for run 1" }).getByRole("listitem");
  await expect(line).toContainText("Thrust 3.92 N ≥ 3.5 N");
  await expect(line).toContainText("pass");

  // The comparison shows thrust in the criterion's unit, and in gram-force once switched.
  const thrustRow = page.getByRole("row").filter({ has: page.getByRole("rowheader", { name: /Thrust\b/ }) }).filter({ hasNot: page.getByText("Thrust per watt") });
  await expect(thrustRow.getByRole("cell")).toHaveText(["3.92"]);
  await page.getByLabel("Unit for thrust", { exact: true }).selectOption("gf");
  await expect(thrustRow.getByRole("cell")).toHaveText(["400"]);
  await run.scrollIntoViewIfNeeded();
  await snap(page, "bench-reading-01-criterion-line");

  // A photo on the iteration: its thumbnail loads from storage through its signed link.
  await page.getByRole("navigation", { name: "Parts of the episode" }).getByRole("link", { name: "Build log" }).click();
  const iteration = page.getByRole("listitem", { name: "Iteration 1" });
  await expect(iteration.getByText("No photos of this iteration yet.")).toBeVisible();
  await iteration.getByLabel("Add a photo").setInputFiles(photo);
  const thumbnail = iteration.getByRole("img", { name: "Iteration 1: build-photo.jpg" });
  await expect(thumbnail).toBeVisible();
  await expect(thumbnail).toHaveJSProperty("naturalWidth", 160);
  await iteration.scrollIntoViewIfNeeded();
  await snap(page, "bench-reading-02-iteration-photo");
  await page.setViewportSize({ width: 390, height: 844 });
  await iteration.scrollIntoViewIfNeeded();
  expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
  await snap(page, "bench-reading-03-iteration-photo-phone");
  await page.setViewportSize({ width: 1280, height: 800 });

  // Removing it asks first.
  page.once("dialog", (dialog) => void dialog.accept());
  await iteration.getByRole("button", { name: "Remove photo build-photo.jpg" }).click();
  await expect(thumbnail).toHaveCount(0);
  await expect(iteration.getByText("No photos of this iteration yet.")).toBeVisible();

  // The shelf: masses in one unit, a search, and its empty answer.
  await page.goto(`/c/${channelId}/shelf`);
  const table = page.getByRole("table", { name: "Parts on the shelf" });
  await expect(table).toBeVisible({ timeout: 30_000 });
  await page.getByLabel("Masses in").selectOption("g");
  // 1.1 oz = 31.18 g (NIST SP 811 (2008), B.8: 1 oz = 28.349523125 g).
  await expect(table.getByRole("row", { name: /Rowan 2306 motor/ })).toContainText("31.18");
  await expect(table.getByRole("row", { name: /Spruce frame/ })).toContainText("no power");
  await page.getByLabel("Order").selectOption("mass");
  await expect(table.getByRole("rowheader")).toHaveText(["Hazel 5-inch prop", "Rowan 2306 motor", "Spruce frame"]);
  await page.getByLabel("Find a part").fill("mill lane");
  await expect(table.getByRole("rowheader")).toHaveText(["Hazel 5-inch prop"]);
  await snap(page, "bench-reading-04-shelf-search");
  await page.getByLabel("Find a part").fill("servo");
  await expect(page.getByText("No part matches")).toBeVisible();
  await page.setViewportSize({ width: 390, height: 844 });
  await page.getByLabel("Find a part").fill("");
  await expect(table.getByRole("rowheader")).toHaveCount(3);
  expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
  await snap(page, "bench-reading-05-shelf-phone");
  await page.setViewportSize({ width: 1280, height: 800 });

  // A part that takes no power is not asked for a rated voltage.
  await page.getByRole("button", { name: "Add a part" }).click();
  const form = page.getByRole("form", { name: "New part" });
  await expect(form.getByLabel("Rated voltage", { exact: true })).toBeVisible();
  await form.getByLabel("Takes power").uncheck();
  await expect(form.getByLabel("Rated voltage", { exact: true })).toHaveCount(0);
  await form.getByLabel("Name", { exact: true }).fill("Passive 80 mm fan");
  await form.getByLabel("Kind").selectOption("fan");
  await form.getByRole("button", { name: "Add to the shelf" }).click();
  await expect(page.getByText("Passive 80 mm fan is on the shelf.")).toBeVisible();
  await expect(table.getByRole("row", { name: /Passive 80 mm fan/ })).toContainText("no power");
});
