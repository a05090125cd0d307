import { describe, expect, it } from "vitest";
import { fieldMessages } from "../http/errors";
import { hazardInputSchema, iterationInputSchema, partInputSchema, plannedQuantitySchema, runInputSchema, testPlanInputSchema } from "./schemas";

const q = (value: number, unit: string) => ({ value, unit });
const messages = (result: { success: boolean; error?: { issues: Parameters<typeof fieldMessages>[0] } }) => (result.success ? {} : fieldMessages(result.error!.issues));

const part = { name: "Tarn 2216", kind: "motor", mass: q(68, "g"), ratedVoltage: q(16.8, "V"), ratedCurrent: q(25, "A"), price: { amount: "24.90", currency: "EUR" }, supplier: "", notes: "" };
const run = { label: "Motor B on 3S", parts: [], supply: { kind: "lipo", cells: 3 }, measurements: { mass: q(2.4, "oz"), current: q(9800, "mA") }, notes: "" };

describe("the test plan's fields", () => {
  it("accepts a plan with quantities in any unit of their kind", () => {
    const plan = { hypothesis: "One rotor beats twelve fans.", method: "Clamp, spin up, read the scale.", quantities: [{ name: "Static thrust", symbol: "T", measures: "thrust", unit: "gf" }], airframeMass: q(420, "g") };
    expect(testPlanInputSchema.safeParse(plan).success).toBe(true);
  });

  it("when a quantity's unit is of another kind, then the unit field says which units fit", () => {
    const result = plannedQuantitySchema.safeParse({ name: "Static thrust", symbol: "T", measures: "thrust", unit: "g" });
    expect(messages(result)).toEqual({ unit: "Thrust is measured in gf, kgf, N" });
  });

  it("refuses a negative airframe mass, and thrust written as an airframe mass", () => {
    expect(messages(testPlanInputSchema.safeParse({ hypothesis: "", method: "", quantities: [], airframeMass: q(-1, "g") }))).toEqual({ "airframeMass.value": "The airframe's mass cannot be negative" });
    expect(messages(testPlanInputSchema.safeParse({ hypothesis: "", method: "", quantities: [], airframeMass: q(1, "gf") }))).toEqual({ airframeMass: "the airframe's mass must be in g, kg, oz, lb" });
  });
});

describe("hazards", () => {
  it("needs a mitigation, and a name when typed in", () => {
    expect(hazardInputSchema.safeParse({ kind: "lipo_overcharge", mitigation: "Balance charger." }).success).toBe(true);
    expect(messages(hazardInputSchema.safeParse({ kind: "lipo_overcharge", mitigation: "  " }))).toEqual({ mitigation: "Say how the risk is kept down." });
    expect(messages(hazardInputSchema.safeParse({ kind: "custom", mitigation: "Gloves." }))).toEqual({ title: "Name the hazard." });
    expect(hazardInputSchema.safeParse({ kind: "lasers", mitigation: "Goggles." }).success).toBe(false);
  });
});

describe("parts on the shelf", () => {
  it("accepts a part with its ratings and price", () => {
    expect(partInputSchema.safeParse(part).success).toBe(true);
  });

  it("takes a part to need power unless told, and wants no rated voltage for one that doesn't", () => {
    expect(partInputSchema.parse(part).powered).toBe(true);
    expect(partInputSchema.safeParse({ ...part, kind: "frame", powered: false, ratedVoltage: null }).success).toBe(true);
    expect(messages(partInputSchema.safeParse({ ...part, kind: "fan", powered: false }))).toEqual({
      ratedVoltage: "A part that takes no power has no rated voltage: clear it, or mark the part as needing power.",
    });
  });

  it("says which field is wrong", () => {
    const bad = { ...part, mass: q(68, "V"), ratedVoltage: q(16.8, "A"), price: { amount: "24,90", currency: "euro" } };
    expect(messages(partInputSchema.safeParse(bad))).toEqual({
      mass: "mass must be in g, kg, oz, lb",
      ratedVoltage: "rated voltage must be in V, mV",
      "price.amount": "Write the price as a number such as 12.50.",
      "price.currency": "Use a three-letter currency code such as EUR or USD (ISO 4217).",
    });
  });
});

describe("bench runs", () => {
  it("accepts mixed units: ounces, milliamps, a pack by cell count", () => {
    expect(runInputSchema.safeParse(run).success).toBe(true);
  });

  it("when thrust is entered as a mass, then the thrust field asks for a force", () => {
    const result = runInputSchema.safeParse({ ...run, measurements: { thrust: q(700, "g") } });
    expect(messages(result)).toEqual({ "measurements.thrust": "thrust must be in gf, kgf, N" });
  });

  it("refuses negative readings, unknown measurements, a part twice and too many cells", () => {
    const partId = "3f2b0a52-4a8e-4d57-9a3e-1c1d3b7f0e11";
    expect(messages(runInputSchema.safeParse({ ...run, measurements: { current: q(-2, "A") } }))).toEqual({ "measurements.current.value": "Current cannot be negative" });
    expect(runInputSchema.safeParse({ ...run, measurements: { rpm: q(1, "s") } }).success).toBe(false);
    expect(messages(runInputSchema.safeParse({ ...run, parts: [{ partId, count: 1 }, { partId, count: 2 }] }))).toEqual({ "parts.1.partId": "This part is already in the run; raise its count instead." });
    expect(messages(runInputSchema.safeParse({ ...run, supply: { kind: "lipo", cells: 15 } }))).toEqual({ "supply.cells": "Kerf knows packs of 1 to 14 cells" });
  });
});

describe("build iterations", () => {
  it("need what changed and an outcome", () => {
    expect(iterationInputSchema.safeParse({ change: "Printed arms", allUpMass: q(1.3, "lb"), outcome: "worked", chosenRunId: null, notes: "" }).success).toBe(true);
    expect(messages(iterationInputSchema.safeParse({ change: "", allUpMass: null, outcome: "maybe", chosenRunId: null, notes: "" }))).toEqual({
      change: "Say what changed in this iteration.",
      outcome: "Pick an outcome.",
    });
  });
});

describe("strict requests", () => {
  it("refuses fields Kerf doesn't know, at the top and inside quantities", async () => {
    const { criterionInputSchema } = await import("./schemas");
    expect(criterionInputSchema.safeParse({ metric: "thrust", comparator: "gte", threshold: q(700, "gf"), required: true, " ": {} }).success).toBe(false);
    expect(criterionInputSchema.safeParse({ metric: "thrust", comparator: "gte", threshold: { value: 700, unit: "gf", extra: 1 }, required: true }).success).toBe(false);
    expect(partInputSchema.safeParse({ ...part, mass: { value: 1, unit: "g", note: "x" } }).success).toBe(false);
  });
});
