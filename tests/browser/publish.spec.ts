import { expect, test } from "@playwright/test";
import { expectNoSeriousA11yViolations } from "./axe";
import { expectFitsPhone, hostWithEpisode, snap, sponsoredDeal, sql } from "./support";
import { png } from "../support/png";

test.setTimeout(180_000);

// A CMX 3600 list as SMPTE 258M describes it, with "* LOC:" marker comments (the form OpenTimelineIO's
// cmx_3600 adapter reads); the programme starts at the first event's record in, 01:00:00:00.
const edl = [
  "TITLE: THREE PACKS CUT",
  "FCM: NON-DROP FRAME",
  "",
  "001  A001C003 V     C        10:00:00:00 10:01:00:00 01:00:00:00 01:01:00:00",
  "* LOC: 01:00:00:00 YELLOW  Why this test",
  "* LOC: 01:00:20:00 YELLOW  Building the rig",
  "* LOC: 01:00:45:12 RED     Verdict",
  "",
].join("\r\n");

test("an episode in publish gets its package, passes the gate, and going live starts the sponsor's figures dates", async ({ page }) => {
  const { channelId, episodeId, csrfToken } = await hostWithEpisode(page, {
    host: { name: "Ines Halloran", channel: "Tidewater Test Bench" },
    episode: { title: "Three packs, one bench", question: "Which pack holds 5 A longest?", origin: "sponsor", stage: "publish", targetPublishDate: "2027-03-02" },
  });
  const { dealId } = await sponsoredDeal(page, { channelId, episodeId, csrfToken }, { company: "Kestrel Cells", link: "https://kestrel.example/bench", code: "TIDE10", contact: null, talkingPoints: [], figureDays: [30] });

  await page.goto(`/c/${channelId}/episodes/${episodeId}`);
  // The episode page first (on a loaded machine it can take a while), then its publish part.
  await expect(page.getByRole("heading", { name: "Three packs, one bench" }).first()).toBeVisible({ timeout: 60_000 });
  const section = page.locator("#publish-package");
  const gate = section.getByRole("list", { name: "Missing before go-live" });
  await expect(gate.getByText("No title is chosen.")).toBeVisible({ timeout: 30_000 });

  await section.getByRole("button", { name: "Add a title" }).click();
  await section.getByRole("textbox", { name: "Title 1", exact: true }).fill("Which pack lasts? Three cells on one bench");
  await expect(section.getByText("42 / 100 characters")).toBeVisible();

  await section.getByLabel("Import markers (.edl or .csv)").setInputFiles({ name: "three-packs.edl", mimeType: "text/plain", buffer: Buffer.from(edl) });
  await expect(section.getByText("3 chapters read from three-packs.edl.")).toBeVisible();
  await expect(section.getByLabel("Chapters")).toHaveValue("0:00 Why this test\n0:20 Building the rig\n0:45 Verdict");
  await expect(section.getByText("The chapters keep the platform's rules.")).toBeVisible();

  await section.getByRole("button", { name: "Draft from the episode" }).click();
  const description = section.getByLabel("Description");
  await expect(description).toHaveValue(/^Paid partnership with Kestrel Cells\./);
  await expect(description).toHaveValue(/Kestrel Cells: https:\/\/kestrel\.example\/bench/);
  await expect(description).toHaveValue(/0:45 Verdict/);

  await section.getByLabel("Add a thumbnail").setInputFiles({ name: "cover.png", mimeType: "image/png", buffer: png(1280, 720) });
  await expect(section.getByText("Keeps the platform's thumbnail rules.")).toBeVisible();
  await section.getByLabel("Use cover.png").check();
  await section.getByRole("button", { name: "Save the package" }).click();
  await expect(section.getByText("The package has everything the video needs.")).toBeVisible();
  await section.scrollIntoViewIfNeeded();
  await snap(page, "publish-01-package-ready");
  await expectNoSeriousA11yViolations(page, "publish package");
  // On a phone the package fits the screen's width: nothing scrolls sideways.
  await page.setViewportSize({ width: 390, height: 844 });
  await section.getByRole("button", { name: "Save the package" }).scrollIntoViewIfNeeded();
  await snap(page, "publish-01b-package-phone");
  await expectFitsPhone(page, "publish package");
  await page.setViewportSize({ width: 1280, height: 800 });

  await section.getByLabel("Link to the published video").fill("https://video.example/watch/tidewater-3");
  await section.getByRole("button", { name: "Mark published" }).click();
  await expect(section.getByText(/^Published /)).toBeVisible();
  await snap(page, "publish-02-live");

  // Going live dated the deal: its go-live day is set, the go-live item done, the figures due 30 days on.
  const [dated] = await sql<{ live: string; report: string; status: string }>(
    `select d.go_live_date::text as live, r.due_date::text as report, g.status::text as status
       from deals d join deliverables r on r.deal_id = d.id and r.kind = 'report' join deliverables g on g.deal_id = d.id and g.kind = 'go_live'
      where d.id = $1`,
    [dealId],
  );
  expect(dated!.live).not.toBeNull();
  expect(dated!.status).toBe("done");
  const expected = new Date(`${dated!.live}T00:00:00Z`);
  expected.setUTCDate(expected.getUTCDate() + 30);
  expect(dated!.report).toBe(expected.toISOString().slice(0, 10));
  await page.getByRole("navigation", { name: "Parts of the episode" }).getByRole("link", { name: "Sponsor deals" }).click();
  await expect(page.locator("#sponsor-deals").getByTestId("item-report").getByTestId("due-date")).not.toHaveText("");
});
