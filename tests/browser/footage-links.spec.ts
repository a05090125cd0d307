import path from "node:path";
import { expect, test, type Page } from "@playwright/test";
import { hostWithEpisode, snap } from "./support";

// The 29.97 drop-frame test clip of the player journey (its making is described in rushes-player.spec.ts).
const clipFile = path.resolve(import.meta.dirname, "../fixtures/rushes/D003_C007.mov");
const q = (value: number, unit: string) => ({ value, unit });

async function runThroughApi(page: Page, channelId: string, episodeId: string, csrfToken: string) {
  const post = async (url: string, data: unknown) => {
    const response = await page.request.post(url, { headers: { "x-csrf-token": csrfToken }, data });
    expect(response.status(), `${url}: ${await response.text()}`).toBe(201);
    return response.json();
  };
  const blank = { ratedCurrent: null, price: null, supplier: "", notes: "" };
  const motor = (await post(`/api/channels/${channelId}/bench/parts`, { name: "Larch 2207 motor", kind: "motor", mass: q(31, "g"), ratedVoltage: q(16.8, "V"), ...blank })).part;
  const episode = `/api/channels/${channelId}/episodes/${episodeId}`;
  await post(`${episode}/bench-runs`, { label: "Larch on 4S", parts: [{ partId: motor.id, count: 1 }], supply: { kind: "lipo", cells: 4 }, measurements: { thrust: q(900, "gf") }, notes: "" });
}

test("a clip is tied to the bench run it shows, from the run's card and from the clip panel, and the card lists it with its poster", async ({ page }) => {
  test.setTimeout(150_000);
  const { channelId, episodeId, csrfToken } = await hostWithEpisode(page, {
    host: { name: "Aurelie Mbeki", channel: "Wharf Street Thrust" },
    episode: { title: "Can a 2207 lift a camera?", question: "Is 900 gf enough?", origin: "idea", stage: "build" },
  });
  await runThroughApi(page, channelId, episodeId, csrfToken);
  await page.goto(`/c/${channelId}/episodes/${episodeId}/footage`);
  await page.getByLabel("Camera files").setInputFiles(clipFile);
  await expect(page.getByRole("listitem", { name: "Upload of D003_C007.mov" }).getByText(/^Stored/)).toBeVisible({ timeout: 30_000 });

  // From the run's card: link the clip; it is listed with its poster; unlink it.
  const parts = page.getByRole("navigation", { name: "Parts of the episode" });
  await parts.getByRole("link", { name: /Bench runs/ }).click();
  const footage = page.getByRole("region", { name: "Footage of run 1" });
  const linkForm = footage.getByRole("form", { name: "Link a clip to run 1" });
  await expect(linkForm.getByLabel("Link a clip").locator("option", { hasText: "D003_C007.mov" })).toHaveCount(1);
  await linkForm.getByLabel("Link a clip").selectOption({ label: "D003_C007.mov" });
  await linkForm.getByRole("button", { name: "Link" }).click();
  const shown = footage.getByRole("listitem", { name: "D003_C007.mov" });
  await expect(shown).toBeVisible();
  await expect(shown.locator("img")).toBeVisible({ timeout: 30_000 });
  await snap(page, "footage-links-01-run-card");
  await shown.getByRole("button", { name: "Unlink D003_C007.mov from run 1" }).click();
  await expect(shown).toHaveCount(0);

  // From the clip panel: the same link, saved with the log.
  await parts.getByRole("link", { name: "Footage" }).click();
  await page.getByRole("table").getByRole("button", { name: "D003_C007.mov" }).click();
  const panel = page.getByRole("dialog");
  await panel.getByLabel("Bench run shown").selectOption({ label: "Run 1 · Larch on 4S" });
  await panel.getByRole("button", { name: "Save log" }).click();
  await expect(panel.getByText("Log saved.")).toBeVisible();
  await panel.getByRole("button", { name: "Close" }).click();
  await parts.getByRole("link", { name: /Bench runs/ }).click();
  await expect(footage.getByRole("listitem", { name: "D003_C007.mov" })).toBeVisible();

  // At phone width the card and its footage stay inside the screen.
  await page.setViewportSize({ width: 390, height: 844 });
  await footage.scrollIntoViewIfNeeded();
  await expect.poll(() => page.evaluate(() => document.documentElement.scrollWidth <= document.documentElement.clientWidth)).toBe(true);
  await snap(page, "footage-links-02-phone");
});
