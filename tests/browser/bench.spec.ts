import { expect, test, type Locator, type Page } from "@playwright/test";
import { hostWithEpisode, snap } from "./support";

/** The new-part form stays open after each part, ready for the next. */
async function addPart(page: Page, part: { name: string; kind: string; mass: string; massUnit: string; volts: string }) {
  const form = page.getByRole("form", { name: "New part" });
  await form.getByLabel("Name", { exact: true }).fill(part.name);
  await form.getByLabel("Kind").selectOption(part.kind);
  await form.getByLabel("Mass", { exact: true }).fill(part.mass);
  await form.getByLabel("Unit of mass").selectOption(part.massUnit);
  await form.getByLabel("Rated voltage", { exact: true }).fill(part.volts);
  await form.getByRole("button", { name: "Add to the shelf" }).click();
  await expect(page.getByText(`${part.name} is on the shelf.`)).toBeVisible();
}

async function addCriterion(form: Locator, metric: string, value: string, unit: string) {
  await form.getByLabel("Metric").selectOption(metric);
  await form.getByLabel("Threshold", { exact: true }).fill(value);
  await form.getByLabel("Unit of threshold").fill(unit);
  await form.getByRole("button", { name: "Add criterion" }).click();
}

async function enterRun(
  page: Page,
  run: { label: string; part: string; supply: "lipo" | "bench"; cells?: string; benchVolts?: string; readings: [label: string, value: string, unit: string][] },
) {
  await page.getByRole("button", { name: "Enter a bench run" }).click();
  const form = page.getByRole("form", { name: "New bench run" });
  await form.getByLabel("Configuration").fill(run.label);
  await form.getByRole("button", { name: "Add a part" }).click();
  await form.getByLabel("Part 1", { exact: true }).selectOption({ label: run.part });
  await form.getByLabel("Power from").selectOption(run.supply);
  if (run.cells) await form.getByLabel("Cells in series").fill(run.cells);
  if (run.benchVolts) await form.getByLabel("Supply voltage", { exact: true }).fill(run.benchVolts);
  for (const [label, value, unit] of run.readings) {
    await form.getByLabel(label, { exact: true }).fill(value);
    await form.getByLabel(`Unit of ${label.toLowerCase()}`).selectOption(unit);
  }
  return form;
}

test("a host plans a test, measures three candidates in mixed units and sees the plan pick one", async ({ page }) => {
  // One long journey through four screens, with full-page screenshots of a long page.
  test.setTimeout(180_000);
  const { channelId, episodeId } = await hostWithEpisode(page, {
    host: { name: "Saga Ellingsen", channel: "Wharf Street Lift Lab" },
    episode: { title: "Can one rotor lift the frame?", question: "Which motor lifts a 400 g frame best?", origin: "idea", stage: "test_plan" },
  });

  // The shelf: three candidates, weighed in grams and ounces.
  await page.goto(`/c/${channelId}/shelf`);
  await expect(page.getByText("The shelf is empty")).toBeVisible();
  await page.getByRole("button", { name: "Add a part" }).click();
  await addPart(page, { name: "Alder 2212 motor", kind: "motor", mass: "2", massUnit: "oz", volts: "12.6" });
  await addPart(page, { name: "Birch 2216 motor", kind: "motor", mass: "68", massUnit: "g", volts: "16.8" });
  await addPart(page, { name: "Cedar 120 mm fan", kind: "fan", mass: "160", massUnit: "g", volts: "12" });
  await expect(page.getByRole("link", { name: "Birch 2216 motor" })).toBeVisible();
  await snap(page, "bench-01-shelf");

  // The test plan: a hypothesis, the airframe, two required criteria.
  await page.goto(`/c/${channelId}/episodes/${episodeId}`);
  const plan = page.getByRole("form", { name: "Test plan" });
  await plan.getByLabel("Hypothesis").fill("The 2216 motor lifts the 400 g frame with margin and at least 5 gf of thrust per watt.");
  await plan.getByLabel("Method").fill("Clamp each candidate to the stand, run 30 s, read the scale and the meter.");
  await plan.getByLabel("Airframe mass", { exact: true }).fill("400");
  await plan.getByRole("button", { name: "Save the test plan" }).click();
  await expect(page.getByText("Test plan saved.")).toBeVisible();

  // Each add form opens from its button and closes once its entry is saved.
  const addCriterionButton = page.getByRole("button", { name: "Add a criterion" });
  await addCriterionButton.click();
  const newCriterion = page.getByRole("form", { name: "New criterion" });
  await addCriterion(newCriterion, "thrust_to_weight", "1", "1");
  await expect(page.getByText("Thrust-to-weight ≥ 1", { exact: true })).toBeVisible();
  await expect(newCriterion).toHaveCount(0);
  await expect(addCriterionButton).toBeFocused();
  await addCriterionButton.click();

  // A criterion in the wrong unit: thrust per watt against grams is refused on the unit, with the units that fit.
  await addCriterion(newCriterion, "thrust_per_watt", "5", "g");
  await expect(newCriterion.getByText("The threshold is in g but thrust per watt is in gf/W")).toBeVisible();
  await expect(newCriterion.getByText("In gf/W, kgf/W, N/W.")).toBeVisible();
  await snap(page, "bench-02-criterion-wrong-unit");
  await newCriterion.getByLabel("Unit of threshold").fill("gf/W");
  await newCriterion.getByRole("button", { name: "Add criterion" }).click();
  await expect(page.getByText("Thrust per watt ≥ 5 gf/W", { exact: true })).toBeVisible();

  // Safety: a listed hazard with its usual caution, checked by the host.
  const addHazardButton = page.getByRole("button", { name: "Add a hazard" });
  await addHazardButton.click();
  const hazard = page.getByRole("form", { name: "New hazard" });
  await hazard.getByLabel("Hazard").selectOption("spinning_blades");
  await expect(hazard.getByText("A propeller or fan blade can cut deeply")).toBeVisible();
  await hazard.getByRole("button", { name: "Add hazard" }).click();
  const blades = page.getByRole("listitem", { name: "Spinning blades and propellers" });
  await blades.getByRole("button", { name: "Mark as checked by me" }).click();
  await expect(blades.getByText("Checked by Saga Ellingsen")).toBeVisible();
  // A listed hazard goes on the plan once; removing one asks first.
  await expect(hazard).toHaveCount(0);
  await addHazardButton.click();
  await expect(hazard.locator('option[value="spinning_blades"]')).toHaveCount(0);
  await hazard.getByLabel("Hazard").selectOption("custom");
  await hazard.getByLabel("Name of the hazard").fill("Hot glue gun");
  await hazard.getByLabel("Mitigation").fill("Stand and silicone mat.");
  await hazard.getByRole("button", { name: "Add hazard" }).click();
  const glue = page.getByRole("listitem", { name: "Hot glue gun" });
  await glue.getByRole("button", { name: "Remove" }).click();
  await expect(glue.getByText("Remove “Hot glue gun” from the plan?")).toBeVisible();
  await glue.getByRole("button", { name: "Keep it" }).click();
  await glue.getByRole("button", { name: "Remove" }).click();
  await glue.getByRole("button", { name: "Yes, remove it" }).click();
  await expect(glue).toHaveCount(0);
  await expect(page.getByText("Local codes, manufacturer ratings and licensed practice govern.")).toBeVisible();
  await expect(page.getByText("Flying rules differ by country")).toBeVisible();
  await snap(page, "bench-03-test-plan");

  // Three candidates in mixed units: mA and A, oz and g, a LiPo by cell count and a bench supply.
  // Own derivations: Alder 11.1 V × 8.2 A = 91.02 W, 380 gf / 91.02 W = 4.17 gf/W (fail);
  // Birch 11.1 V × 9.8 A = 108.78 W, 6.99 gf/W; 760 gf over 400 g + 2.4 oz (68.04 g) = 1.62 (pass);
  // Cedar 12 V × 1.6 A = 19.2 W, 95 gf / 19.2 W = 4.95 gf/W (fail), 95 gf over 560 g = 0.17 (fail).
  const parts = page.getByRole("navigation", { name: "Parts of the episode" });
  await parts.getByRole("link", { name: "Bench runs" }).click();
  let form = await enterRun(page, { label: "Alder on 3S", part: "Alder 2212 motor (Motor)", supply: "lipo", cells: "3", readings: [["Voltage", "11.1", "V"], ["Current", "8200", "mA"], ["Thrust", "380", "gf"]] });
  await expect(form.getByText("3S LiPo: 11.1 V nominal, 12.6 V full")).toBeVisible();
  await form.getByRole("button", { name: "Save run" }).click();
  await expect(page.getByRole("listitem", { name: "Run 1: Alder on 3S" }).getByText("Misses the plan", { exact: true })).toBeVisible();

  form = await enterRun(page, { label: "Birch on 3S", part: "Birch 2216 motor (Motor)", supply: "lipo", cells: "3", readings: [["Mass", "2.4", "oz"], ["Voltage", "11.1", "V"], ["Current", "9.8", "A"], ["Thrust", "760", "gf"]] });
  await form.getByRole("button", { name: "Save run" }).click();
  const birch = page.getByRole("listitem", { name: "Run 2: Birch on 3S" });
  await expect(birch.getByText("Meets the plan", { exact: true })).toBeVisible();
  await expect(birch.getByText("2.4 oz = 68.04 g")).toBeVisible();
  await expect(birch.getByText("6.99 gf/W", { exact: true })).toBeVisible();

  form = await enterRun(page, { label: "Cedar fan on the bench supply", part: "Cedar 120 mm fan (Fan)", supply: "bench", benchVolts: "12", readings: [["Voltage", "12", "V"], ["Current", "1600", "mA"], ["Thrust", "95", "gf"]] });
  await form.getByRole("button", { name: "Save run" }).click();
  await expect(page.getByRole("listitem", { name: "Run 3: Cedar fan on the bench supply" }).getByText("Misses the plan", { exact: true })).toBeVisible();

  // The comparison and the chart pick the Birch motor.
  await expect(page.locator("figcaption").filter({ hasText: "Best candidate: run 2, Birch on 3S." })).toBeVisible();
  const chart = page.getByRole("img", { name: /Thrust per watt against mass/ });
  await expect(chart).toBeVisible();
  await expect(chart.getByText("Best: run 2")).toBeVisible();
  await expect(chart.getByText("Mass (g)")).toBeVisible();
  await expect(chart.getByText("Thrust per watt (gf/W)")).toBeVisible();
  await page.getByRole("button", { name: /^Thrust per watt$/ }).click();
  await expect(page.getByRole("rowheader", { name: /Thrust per watt/ })).toHaveAttribute("aria-sort", "descending");
  await expect(page.getByRole("columnheader").first()).toContainText("Run 2");
  await page.getByRole("region", { name: "Bench runs" }).scrollIntoViewIfNeeded();
  await snap(page, "bench-04-verdicts-and-chart");

  const csvLink = page.getByRole("link", { name: "Download the runs as CSV" });
  const csv = await page.request.get((await csvLink.getAttribute("href"))!);
  expect(csv.headers()["content-type"]).toContain("text/csv");
  expect(await csv.text()).toContain("\r\n2,Birch on 3S,1 × Birch 2216 motor,");

  // Over-volting the 12.6 V Alder on a 4S pack (16.8 V full, common practice): the caution shows before and after saving.
  form = await enterRun(page, { label: "Alder on 4S", part: "Alder 2212 motor (Motor)", supply: "lipo", cells: "4", readings: [["Voltage", "16.2", "V"], ["Current", "6", "A"]] });
  await expect(form.getByRole("note", { name: "Over-rated: Alder 2212 motor" })).toContainText("above the part's rated 12.6 V");
  await form.getByRole("button", { name: "Save run" }).click();
  const overVolted = page.getByRole("listitem", { name: "Run 4: Alder on 4S" });
  await expect(overVolted.getByRole("note", { name: /Over-rated: Alder 2212 motor \(4\.2 V over\)/ })).toContainText("local codes and licensed practice");
  await overVolted.scrollIntoViewIfNeeded();
  await snap(page, "bench-05-over-rated");

  // The build log takes its thrust from the chosen run and its mass from the scale.
  await parts.getByRole("link", { name: "Build log" }).click();
  await page.getByRole("button", { name: "Log an iteration" }).click();
  const iteration = page.getByRole("form", { name: "New iteration" });
  await iteration.getByLabel("What changed").fill("First frame with the Birch motor");
  await iteration.getByLabel("All-up mass", { exact: true }).fill("1.2");
  await iteration.getByLabel("Unit of all-up mass").selectOption("lb");
  await iteration.getByLabel("Outcome").selectOption("worked");
  await iteration.getByLabel("Thrust from run").selectOption({ label: "Run 2: Birch on 3S" });
  await iteration.getByRole("button", { name: "Log iteration" }).click();
  // NIST SP 811, B.8: 1.2 lb = 544.31 g; own derivation: 760 gf over 544.31 g = 1.40.
  const first = page.getByRole("listitem", { name: "Iteration 1" });
  await expect(first.getByText("1.4", { exact: true })).toBeVisible();
  await expect(first.getByText("1.2 lb = 544.3 g")).toBeVisible();
  await snap(page, "bench-06-build-log");

  // The part's page lists every run it was in.
  await page.goto(`/c/${channelId}/shelf`);
  await page.getByRole("link", { name: "Alder 2212 motor" }).click();
  await expect(page.getByRole("heading", { name: "Runs with this part" })).toBeVisible();
  await expect(page.getByRole("cell", { name: /Run 1: Alder on 3S/ })).toBeVisible();
  await expect(page.getByRole("cell", { name: /Run 4: Alder on 4S/ })).toContainText("over-rated");
  await snap(page, "bench-07-part-page");
});
