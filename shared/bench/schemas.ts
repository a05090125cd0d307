import { z } from "zod";
import { multiLine, oneLine } from "../fields/text";
import { type Criterion, type MetricName, criterionSchema } from "./criteria";
import { type Figure, type FigureName, measurementDimensions, measurementSymbols, runMeasurementsSchema } from "./figures";
import { measurementLabels } from "./metrics";
import { CUSTOM_HAZARD, hazardKinds } from "./hazards";
import { cellCountSchema, type RatingCheck, type LowVoltageCheck } from "./packs";
import { type Quantity, dimensionOf, isKnownUnit, quantityOfSchema, unitSchema, unitsByDimension } from "./quantity";
import type { PlanVerdict, CriterionOutcome } from "./criteria";

export { measurementLabels } from "./metrics";

/** Request and response shapes of the bench feature: the same schemas check the forms and the API. */

// Names and labels are one line; the hypothesis, method, mitigations and notes keep their line breaks.
const tooLong = (max: number, what: string) => `Keep ${what} under ${max} characters.`;
const line = (max: number, what: string) => oneLine(max, { tooLong: tooLong(max, what) });
const requiredLine = (max: number, what: string, empty: string) => oneLine(max, { blank: empty, tooLong: tooLong(max, what) });
const lines = (max: number, what: string) => multiLine(max, { tooLong: tooLong(max, what) });
const requiredLines = (max: number, what: string, empty: string) => multiLine(max, { blank: empty, tooLong: tooLong(max, what) });

const nonNegative = <S extends z.ZodType<Quantity>>(schema: S, what: string) =>
  schema.refine((q) => q.value >= 0, { message: `${what} cannot be negative`, path: ["value"] });

// ── Test plan ────────────────────────────────────────────────────────────────

/** One quantity the plan measures: its own name and symbol, what kind of measurement it is, and its unit. */
export const plannedQuantitySchema = z
  .strictObject({
    name: requiredLine(80, "the name", "Name the quantity, such as “static thrust”."),
    symbol: requiredLine(12, "the symbol", "Give it a symbol, such as T."),
    measures: z.enum(measurementSymbols, { error: "Pick what the quantity measures." }),
    unit: unitSchema,
  })
  .superRefine((quantity, ctx) => {
    const dimension = measurementDimensions[quantity.measures];
    if (isKnownUnit(quantity.unit) && dimensionOf(quantity.unit) !== dimension) {
      ctx.addIssue({
        code: "custom",
        path: ["unit"],
        message: `${measurementLabels[quantity.measures]} is measured in ${unitsByDimension[dimension].join(", ")}`,
      });
    }
  });
export type PlannedQuantity = z.infer<typeof plannedQuantitySchema>;

export const testPlanInputSchema = z.strictObject({
  hypothesis: lines(2000, "the hypothesis"),
  method: lines(4000, "the method"),
  quantities: z.array(plannedQuantitySchema).max(20, "A plan measures at most 20 quantities."),
  airframeMass: nonNegative(quantityOfSchema("mass", "the airframe's mass"), "The airframe's mass").nullable(),
});
export type TestPlanInput = z.infer<typeof testPlanInputSchema>;

export const criterionInputSchema = criterionSchema;
export type CriterionInput = Criterion;
export type CriterionView = Criterion & { id: string; position: number; version: number };

// ── Safety ───────────────────────────────────────────────────────────────────

export const hazardChoices = [...hazardKinds, CUSTOM_HAZARD] as const;

export const hazardInputSchema = z
  .strictObject({
    kind: z.enum(hazardChoices, { error: "Pick a hazard from the list, or “other” to type one in." }),
    title: line(120, "the hazard's name").optional(),
    mitigation: requiredLines(1000, "the mitigation", "Say how the risk is kept down."),
  })
  .superRefine((hazard, ctx) => {
    if (hazard.kind === CUSTOM_HAZARD && !hazard.title) {
      ctx.addIssue({ code: "custom", path: ["title"], message: "Name the hazard." });
    }
  });
export type HazardInput = z.infer<typeof hazardInputSchema>;

/** A change to a hazard; `checked` true records the caller as the person who checked it. */
export const hazardChangeSchema = z
  .strictObject({
    title: requiredLine(120, "the hazard's name", "Name the hazard.").optional(),
    mitigation: requiredLines(1000, "the mitigation", "Say how the risk is kept down.").optional(),
    checked: z.boolean().optional(),
  })
  .refine((change) => Object.keys(change).length > 0, { message: "Nothing to change." });
export type HazardChange = z.infer<typeof hazardChangeSchema>;

/** A safety check at power-on: true records the caller as the person who checked, false takes it back. */
export const hazardCheckSchema = z.strictObject({ checked: z.boolean({ error: "Say whether the hazard is checked." }) });
export type HazardCheck = z.infer<typeof hazardCheckSchema>;

export interface HazardView {
  id: string;
  kind: string;
  title: string;
  caution: string | null;
  mitigation: string;
  checkedBy: { id: string; name: string } | null;
  checkedAt: string | null;
}

export interface TestPlanView {
  episodeId: string;
  hypothesis: string;
  method: string;
  quantities: PlannedQuantity[];
  airframeMass: Quantity | null;
  criteria: CriterionView[];
  hazards: HazardView[];
  updatedAt: string | null;
  /** The sheet's version (0 until first saved); a save sends it. */
  version: number;
}

// ── Bench shelf ──────────────────────────────────────────────────────────────

export const partKinds = ["motor", "propeller", "fan", "battery", "speed_controller", "frame", "other"] as const;
export type PartKind = (typeof partKinds)[number];
export const partKindLabels: Record<PartKind, string> = {
  motor: "Motor",
  propeller: "Propeller",
  fan: "Fan",
  battery: "Battery pack",
  speed_controller: "Speed controller",
  frame: "Frame",
  other: "Other",
};

export const priceSchema = z.strictObject({
  amount: z.string().regex(/^\d{1,7}(\.\d{1,2})?$/, "Write the price as a number such as 12.50."),
  currency: z.string().regex(/^[A-Z]{3}$/, "Use a three-letter currency code such as EUR or USD (ISO 4217)."),
});
export type Price = z.infer<typeof priceSchema>;

/**
 * A part. `powered` false is a part that never takes power (a passive fan, a frame, a propeller): it
 * has no rated voltage, and runs don't ask for one. Left out, a part is taken to need power, as every
 * part did before the choice existed.
 */
export const partInputSchema = z
  .strictObject({
    name: requiredLine(120, "the name", "Name the part."),
    kind: z.enum(partKinds, { error: "Pick what kind of part it is." }),
    powered: z.boolean({ error: "Say whether the part takes power." }).default(true),
    mass: nonNegative(quantityOfSchema("mass", "mass"), "Mass").nullable(),
    ratedVoltage: nonNegative(quantityOfSchema("voltage", "rated voltage"), "The rated voltage").nullable(),
    ratedCurrent: nonNegative(quantityOfSchema("current", "rated current"), "The rated current").nullable(),
    price: priceSchema.nullable(),
    supplier: line(200, "the supplier"),
    notes: lines(2000, "the notes"),
  })
  .superRefine((part, ctx) => {
    if (!part.powered && part.ratedVoltage !== null) {
      ctx.addIssue({ code: "custom", path: ["ratedVoltage"], message: "A part that takes no power has no rated voltage: clear it, or mark the part as needing power." });
    }
  });
export type PartInput = z.infer<typeof partInputSchema>;

export interface PartView extends PartInput {
  id: string;
  runCount: number;
  updatedAt: string;
  version: number;
}

// ── Bench runs ───────────────────────────────────────────────────────────────

export const supplySchema = z.discriminatedUnion(
  "kind",
  [
    z.strictObject({ kind: z.literal("lipo"), cells: cellCountSchema }),
    z.strictObject({ kind: z.literal("bench"), voltage: nonNegative(quantityOfSchema("voltage", "the supply voltage"), "The supply voltage") }),
  ],
  { error: "Pick a LiPo pack or a bench supply." },
);
export type Supply = z.infer<typeof supplySchema>;

export const runPartSchema = z.strictObject({
  partId: z.guid("Pick a part from the shelf."),
  count: z.number({ error: "Say how many." }).int("Count whole parts.").min(1, "At least one.").max(64, "At most 64 of one part."),
});

/** What a run measured, each reading in any unit of its kind and never negative. */
export const runMeasurementsInputSchema = z.strictObject({
  mass: nonNegative(runMeasurementsSchema.shape.mass.unwrap(), "Mass").optional(),
  voltage: nonNegative(runMeasurementsSchema.shape.voltage.unwrap(), "Voltage").optional(),
  current: nonNegative(runMeasurementsSchema.shape.current.unwrap(), "Current").optional(),
  thrust: nonNegative(runMeasurementsSchema.shape.thrust.unwrap(), "Thrust").optional(),
  speed: nonNegative(runMeasurementsSchema.shape.speed.unwrap(), "Speed").optional(),
  run_time: nonNegative(runMeasurementsSchema.shape.run_time.unwrap(), "Run time").optional(),
});

export const runInputSchema = z
  .strictObject({
    label: requiredLine(120, "the configuration's name", "Name the configuration, such as “motor B on 3S”."),
    parts: z.array(runPartSchema).max(12, "A run holds at most 12 different parts."),
    supply: supplySchema.nullable(),
    measurements: runMeasurementsInputSchema,
    notes: lines(2000, "the notes"),
  })
  .superRefine((run, ctx) => {
    const seen = new Set<string>();
    run.parts.forEach((part, index) => {
      if (seen.has(part.partId)) ctx.addIssue({ code: "custom", path: ["parts", index, "partId"], message: "This part is already in the run; raise its count instead." });
      seen.add(part.partId);
    });
  });
export type RunInput = z.infer<typeof runInputSchema>;

export interface RunPartView {
  partId: string;
  name: string;
  kind: PartKind;
  powered: boolean;
  count: number;
  mass: Quantity | null;
  ratedVoltage: Quantity | null;
}

export interface RatingFlag {
  partId: string;
  partName: string;
  check: RatingCheck;
}

export interface RunEvaluation {
  /** Measurements (mass = the configuration's mass, measured or added up from the shelf) and derived figures. */
  values: Partial<Record<MetricName, Figure>>;
  /** Where the configuration's mass came from. */
  massSource: "measured" | "shelf" | "none";
  allUpMass: Figure;
  figures: Record<FigureName, Figure>;
  results: { criterionId: string; required: boolean; outcome: CriterionOutcome }[];
  verdict: PlanVerdict;
  /** The highest voltage the parts saw: the pack at full charge, the bench supply or the measured voltage. */
  supplyVoltage: Quantity | null;
  ratings: RatingFlag[];
  pack: { label: string; nominal: Quantity; full: Quantity; minimum: Quantity; caution: string; low: LowVoltageCheck | null } | null;
}

export interface RunView {
  id: string;
  episodeId: string;
  number: number;
  label: string;
  parts: RunPartView[];
  supply: Supply | null;
  measurements: RunInput["measurements"];
  notes: string;
  evaluation: RunEvaluation;
  createdAt: string;
  updatedAt: string;
  version: number;
}

/** A run as the part's page lists it: with its episode. */
export interface PartRunView {
  runId: string;
  runNumber: number;
  label: string;
  episodeId: string;
  episodeTitle: string;
  count: number;
  verdict: PlanVerdict;
  thrustPerWatt: Figure;
  overRated: boolean;
  createdAt: string;
}

// ── Build log ────────────────────────────────────────────────────────────────

export const iterationOutcomes = ["pending", "worked", "partly", "failed"] as const;
export type IterationOutcome = (typeof iterationOutcomes)[number];
export const iterationOutcomeLabels: Record<IterationOutcome, string> = {
  pending: "Not tried yet",
  worked: "Worked",
  partly: "Partly worked",
  failed: "Failed",
};

export const iterationInputSchema = z.strictObject({
  change: requiredLine(500, "what changed", "Say what changed in this iteration."),
  allUpMass: nonNegative(quantityOfSchema("mass", "all-up mass"), "All-up mass").nullable(),
  outcome: z.enum(iterationOutcomes, { error: "Pick an outcome." }),
  chosenRunId: z.guid("Pick one of this episode's runs.").nullable(),
  notes: lines(2000, "the notes"),
});
export type IterationInput = z.infer<typeof iterationInputSchema>;

export interface IterationView extends IterationInput {
  id: string;
  number: number;
  chosenRun: { id: string; number: number; label: string; thrust: Quantity | null } | null;
  thrustToWeight: Figure;
  createdAt: string;
  version: number;
}

/** A photo of an iteration, with a short-lived link to the image. */
export interface BuildPhotoView {
  id: string;
  iterationId: string;
  fileName: string;
  contentType: string;
  size: number;
  url: string;
  createdAt: string;
}

/** How many photos one iteration keeps: enough for a build's angles, not a place to store a shoot. */
export const MAX_PHOTOS_PER_ITERATION = 12;
