import type { DemoContext } from "./context";
import { hazardCatalogue } from "../../shared/bench/hazards";
import { createCriterion, createHazard, createIteration, createPart, createRun, q, saveTestPlan } from "../../tests/factories/bench";

/**
 * The demo channel's bench (invented, like everything in the demo): the current test-plan episode
 * gets a full sheet, five candidate parts with runs (two miss the plan, one meets it, two are
 * still open, one of them over-volted), and three build iterations. Every name and figure is made up.
 */
export async function seedBenchDemo(context: DemoContext): Promise<void> {
  const { db, channelId, episodes, people } = context;
  const episode = episodes.find((e) => e.title === "Case fans versus one big rotor") ?? episodes.find((e) => e.stage === "test_plan" || e.stage === "build");
  if (!episode) return;
  const owner = people.get("owner")!;
  const crew = people.get("crew")!;
  const producer = people.get("producer")!;

  await saveTestPlan(db, channelId, episode.id, owner.id, {
    hypothesis:
      "One 10-inch rotor on a 2216-size motor gives more thrust per watt than any array of computer fans, " +
      "enough to lift the 420 g test frame with at least 20 % to spare (thrust-to-weight 1.2).",
    method:
      "Each candidate is clamped to the thrust stand on the kitchen scale, zeroed, then run for 30 s at full throttle. " +
      "Voltage and current are read on the inline meter at the 20 s mark; thrust is the steady scale reading. " +
      "Fans run from the bench supply at 12 V, motors from a LiPo pack.",
    quantities: [
      { name: "Mass of the configuration", symbol: "m", measures: "mass", unit: "g" },
      { name: "Voltage under load", symbol: "U", measures: "voltage", unit: "V" },
      { name: "Current draw", symbol: "I", measures: "current", unit: "A" },
      { name: "Static thrust", symbol: "T", measures: "thrust", unit: "gf" },
      { name: "Run time on one pack", symbol: "t", measures: "run_time", unit: "min" },
    ],
    airframeMass: q(420, "g"),
  });
  await createCriterion(db, channelId, episode.id, { metric: "thrust_to_weight", comparator: "gte", threshold: q(1.2, "1"), required: true, note: "Lift the frame with 20 % to spare." });
  await createCriterion(db, channelId, episode.id, { metric: "thrust_per_watt", comparator: "gte", threshold: q(5, "gf/W"), required: true });
  await createCriterion(db, channelId, episode.id, { metric: "electrical_power", comparator: "lte", threshold: q(250, "W"), required: false, note: "The bench supply's limit." });
  await createCriterion(db, channelId, episode.id, { metric: "run_time", comparator: "gte", threshold: q(3, "min"), required: false });

  const hazards = [
    { kind: "lipo_overcharge", checkedBy: owner.id },
    { kind: "lipo_unattended_charging", checkedBy: owner.id },
    { kind: "lipo_puncture", checkedBy: crew.id },
    { kind: "over_voltage", checkedBy: undefined },
    { kind: "spinning_blades", checkedBy: crew.id },
    { kind: "flying", checkedBy: undefined },
  ] as const;
  for (const hazard of hazards) {
    await createHazard(db, channelId, episode.id, { kind: hazard.kind, mitigation: hazardCatalogue[hazard.kind].suggestedMitigation, checkedBy: hazard.checkedBy });
  }
  await createHazard(db, channelId, episode.id, { kind: "custom", title: "Loose fan guards on the array", mitigation: "Guards screwed, not clipped; array tested behind the polycarbonate sheet.", checkedBy: producer.id });

  // Five candidates and the propeller the motors turn; brands and suppliers are invented.
  const supplier = "Hallvard's Hobby Parts (invented)";
  const fan80 = await createPart(db, channelId, { name: "Lumen 80 mm case fan", kind: "fan", mass: q(38, "g"), ratedVoltage: q(12, "V"), ratedCurrent: q(350, "mA"), price: { amount: "6.90", currency: "EUR" }, supplier, notes: "" });
  const fan120 = await createPart(db, channelId, { name: "Brisk 120 mm high-flow fan", kind: "fan", mass: q(5.6, "oz"), ratedVoltage: q(12, "V"), ratedCurrent: q(1.8, "A"), price: { amount: "18.50", currency: "EUR" }, supplier, notes: "Server pull; very loud." });
  const fan140 = await createPart(db, channelId, { name: "Tidal 140 mm fan", kind: "fan", mass: q(120, "g"), ratedVoltage: q(12, "V"), ratedCurrent: q(1.2, "A"), price: { amount: "14.00", currency: "EUR" }, supplier, notes: "" });
  const tarn = await createPart(db, channelId, { name: "Tarn 2216 outrunner, 880 kV", kind: "motor", mass: q(68, "g"), ratedVoltage: q(16.8, "V"), ratedCurrent: q(25, "A"), price: { amount: "24.90", currency: "EUR" }, supplier, notes: "Rated 2S to 4S." });
  const fjell = await createPart(db, channelId, { name: "Fjell 2814 outrunner, 700 kV", kind: "motor", mass: q(110, "g"), ratedVoltage: q(12.6, "V"), ratedCurrent: q(30, "A"), price: { amount: "31.00", currency: "EUR" }, supplier, notes: "Rated 3S only." });
  const prop = await createPart(db, channelId, { name: "Skerry 10 × 4.5 propeller", kind: "propeller", mass: q(14, "g"), ratedVoltage: null, ratedCurrent: null, price: { amount: "3.20", currency: "EUR" }, supplier, notes: "" });

  // Run 1 misses thrust-to-weight: twelve small fans weigh too much for what they push.
  await createRun(db, channelId, episode.id, crew.id, {
    label: "Twelve 80 mm fans on the bench supply",
    parts: [{ partId: fan80.id, count: 12 }],
    supply: { kind: "bench", voltage: q(12, "V") },
    measurements: { voltage: q(11.9, "V"), current: q(4100, "mA"), thrust: q(290, "gf") },
    notes: "All twelve on one harness. Scale wandered ±5 g.",
  });
  // Run 2 misses both required criteria.
  await createRun(db, channelId, episode.id, crew.id, {
    label: "Four 120 mm high-flow fans",
    parts: [{ partId: fan120.id, count: 4 }],
    supply: { kind: "bench", voltage: q(12, "V") },
    measurements: { mass: q(1.4, "lb"), voltage: q(11.8, "V"), current: q(7.2, "A"), thrust: q(410, "gf"), run_time: q(10, "min") },
    notes: "Weighed with the harness and the plate.",
  });
  // Run 3 meets the plan.
  const passing = await createRun(db, channelId, episode.id, crew.id, {
    label: "Tarn with the 10-inch prop on 3S",
    parts: [{ partId: tarn.id, count: 1 }, { partId: prop.id, count: 1 }],
    supply: { kind: "lipo", cells: 3 },
    measurements: { voltage: q(11.1, "V"), current: q(9800, "mA"), thrust: q(760, "gf"), run_time: q(4.5, "min") },
    notes: "Steady; motor warm, not hot, after 30 s.",
  });
  // Run 4 still open: thrust not read yet.
  await createRun(db, channelId, episode.id, crew.id, {
    label: "Six 140 mm fans",
    parts: [{ partId: fan140.id, count: 6 }],
    supply: { kind: "bench", voltage: q(12, "V") },
    measurements: { voltage: q(12, "V"), current: q(5.4, "A") },
    notes: "The scale's battery died before the thrust reading; to be run again.",
  });
  // Run 5 over-volted: a 3S motor on a 4S pack, stopped early.
  await createRun(db, channelId, episode.id, crew.id, {
    label: "Fjell with the 10-inch prop on 4S",
    parts: [{ partId: fjell.id, count: 1 }, { partId: prop.id, count: 1 }],
    supply: { kind: "lipo", cells: 4 },
    measurements: { voltage: q(16.4, "V"), current: q(3.1, "A") },
    notes: "Stopped after 10 s: the case got hot. Above its 3S rating; not repeated.",
  });

  const chosen = passing.id;
  await createIteration(db, channelId, episode.id, crew.id, {
    change: "Bare frame with the Tarn, 10-inch prop and a 3S 1300 mAh pack",
    allUpMass: q(640, "g"),
    outcome: "partly",
    chosenRunId: chosen,
    notes: "Hovered in ground effect only; the pack is heavier than the plan assumed.",
  });
  await createIteration(db, channelId, episode.id, crew.id, {
    change: "Printed arms instead of the aluminium ones",
    allUpMass: q(20.6, "oz"),
    outcome: "worked",
    chosenRunId: chosen,
    notes: "Climbed to the tether's end and held.",
  });
  await createIteration(db, channelId, episode.id, crew.id, {
    change: "Added the camera mount and a guard ring",
    allUpMass: q(655, "g"),
    outcome: "failed",
    chosenRunId: chosen,
    notes: "Too heavy with the guard; back to iteration 2's mass budget.",
  });
}

