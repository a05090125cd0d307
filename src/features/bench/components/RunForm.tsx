import { useState } from "react";
import { useFieldArray, useForm, useWatch, type Path } from "react-hook-form";
import { measurementDimensions, measurementSymbols, type MeasurementSymbol } from "@shared/bench/figures";
import { formatQuantity } from "@shared/bench/format";
import { cellCountSchema, checkVoltageRating, lipoPack, MAX_CELLS } from "@shared/bench/packs";
import { quantitySchema, unitsByDimension, type Quantity } from "@shared/bench/quantity";
import { highestSupplyVoltage } from "@shared/bench/runs";
import { measurementLabels, partKindLabels, runInputSchema, type PartView, type RunInput, type RunView, type Supply, type TestPlanView } from "@shared/bench/schemas";
import { Button } from "../../../components/Button";
import { Notice } from "../../../components/Notice";
import { useOpenedRecord } from "../../../lib/conflicts";
import { useAddRun } from "../api/add-run";
import { useUpdateRun } from "../api/update-run";
import { Caution } from "./marks";
import { FormActions, QuantityField, SelectField, TextAreaField, TextField } from "../../../components/form-fields";
import { type QuantityText, applyServerErrors, converter, errorAt, quantityText } from "../../../lib/forms";
import { schemaResolver } from "../../../lib/schema-resolver";

interface RunFormValues {
  label: string;
  parts: { partId: string; count: string }[];
  supply: { kind: "none" | "lipo" | "bench"; cells: string; voltage: QuantityText };
  measurements: Record<MeasurementSymbol, QuantityText>;
  notes: string;
}

/** The unit a measurement starts in: the plan's choice for it, else the bench's usual one. */
const defaultUnit = (plan: TestPlanView, symbol: MeasurementSymbol) => plan.quantities.find((quantity) => quantity.measures === symbol)?.unit ?? unitsByDimension[measurementDimensions[symbol]][0];

function toValues(plan: TestPlanView, run?: RunView): RunFormValues {
  const supply = run?.supply ?? null;
  const measurements = Object.fromEntries(measurementSymbols.map((symbol) => [symbol, quantityText(run?.measurements[symbol], defaultUnit(plan, symbol))])) as RunFormValues["measurements"];
  return {
    label: run?.label ?? "",
    parts: run?.parts.map((part) => ({ partId: part.partId, count: String(part.count) })) ?? [],
    supply: {
      kind: supply?.kind ?? "lipo",
      cells: supply?.kind === "lipo" ? String(supply.cells) : "3",
      voltage: quantityText(supply?.kind === "bench" ? supply.voltage : null, "V"),
    },
    measurements,
    notes: run?.notes ?? "",
  };
}

function toInput(values: RunFormValues, read = converter()) {
  const parts = values.parts.map((part, index) => ({ partId: part.partId, count: read.number(part.count, `parts.${index}.count`, true) }));
  const supply =
    values.supply.kind === "lipo"
      ? { kind: "lipo", cells: read.number(values.supply.cells, "supply.cells", true) }
      : values.supply.kind === "bench"
        ? { kind: "bench", voltage: read.quantity(values.supply.voltage, "supply.voltage", true) }
        : null;
  const measurements: Record<string, unknown> = {};
  for (const symbol of measurementSymbols) {
    const quantity = read.quantity(values.measurements[symbol], `measurements.${symbol}`);
    if (quantity) measurements[symbol] = quantity;
  }
  return { label: values.label, parts, supply, measurements, notes: values.notes };
}

const serverFields = [
  "label",
  "notes",
  "supply.cells",
  "supply.voltage",
  "supply.voltage.value",
  ...measurementSymbols.flatMap((symbol) => [`measurements.${symbol}`, `measurements.${symbol}.value`, `measurements.${symbol}.unit`]),
] as Path<RunFormValues>[];

export function RunForm({ channelId, episodeId, parts, plan, run, onDone }: { channelId: string; episodeId: string; parts: PartView[]; plan: TestPlanView; run?: RunView; onDone: () => void }) {
  const add = useAddRun(channelId, episodeId);
  const update = useUpdateRun(channelId, episodeId);
  const [problem, setProblem] = useState<string | null>(null);
  const form = useForm<RunFormValues, unknown, RunInput>({ resolver: schemaResolver(runInputSchema, toInput), defaultValues: toValues(plan, run) });
  const record = useOpenedRecord<RunView>(run ?? null, (current) => form.reset(toValues(plan, current)));
  const chosen = useFieldArray({ control: form.control, name: "parts" });
  const errors = form.formState.errors;
  const [supplyKind, watchedParts, watchedSupply, watchedVoltage] = useWatch({ control: form.control, name: ["supply.kind", "parts", "supply", "measurements.voltage"] });

  const onSubmit = form.handleSubmit(async (input) => {
    setProblem(null);
    try {
      if (run) await update.mutateAsync({ id: run.id, input, version: record.version });
      else await add.mutateAsync(input);
      onDone();
    } catch (error) {
      const partFields = input.parts.flatMap((_part, index) => [`parts.${index}.partId`, `parts.${index}.count`] as Path<RunFormValues>[]);
      const message = record.conflictIn(error) ?? applyServerErrors(error, form.setError, [...serverFields, ...partFields]);
      if (message) setProblem(message);
    }
  });

  const partOptions = [{ value: "", label: "Pick a part…" }, ...parts.map((part) => ({ value: part.id, label: `${part.name} (${partKindLabels[part.kind]})` }))];
  const quantityName = (symbol: MeasurementSymbol) => plan.quantities.find((quantity) => quantity.measures === symbol);

  return (
    <form onSubmit={onSubmit} noValidate aria-label={run ? `Edit run ${run.number}` : "New bench run"} className="flex flex-col gap-4">
      <TextField label="Configuration" placeholder="e.g. motor B with a 10-inch propeller on 3S" {...form.register("label")} error={errors.label?.message} />

      <fieldset className="flex flex-col gap-2">
        <legend className="mb-1 text-sm font-medium text-graphite-700">Parts from the shelf</legend>
        {chosen.fields.map((field, index) => (
          <div key={field.id} className="grid items-start gap-2 sm:grid-cols-[1fr_6rem_auto]">
            <SelectField label={`Part ${index + 1}`} options={partOptions} {...form.register(`parts.${index}.partId`)} error={errorAt(errors, `parts.${index}.partId`)} />
            <TextField label="How many" inputMode="numeric" {...form.register(`parts.${index}.count`)} error={errorAt(errors, `parts.${index}.count`)} />
            <Button type="button" tone="quiet" className="sm:mt-6" onClick={() => chosen.remove(index)} aria-label={`Take part ${index + 1} out`}>
              Remove
            </Button>
          </div>
        ))}
        <div>
          <Button type="button" tone="quiet" disabled={parts.length === 0} onClick={() => chosen.append({ partId: parts[0]?.id ?? "", count: "1" })}>
            Add a part
          </Button>
        </div>
      </fieldset>

      <fieldset className="grid items-start gap-3 sm:grid-cols-2">
        <legend className="mb-1 text-sm font-medium text-graphite-700">Supply</legend>
        <SelectField
          label="Power from"
          options={[
            { value: "lipo", label: "LiPo pack, by cell count" },
            { value: "bench", label: "Bench power supply" },
            { value: "none", label: "None / not recorded" },
          ]}
          {...form.register("supply.kind")}
        />
        {supplyKind === "lipo" && <TextField label="Cells in series" inputMode="numeric" hint={`1 to ${MAX_CELLS}, as in 3S`} {...form.register("supply.cells")} error={errorAt(errors, "supply.cells")} />}
        {supplyKind === "bench" && (
          <QuantityField label="Supply voltage" valueProps={form.register("supply.voltage.value")} unitProps={form.register("supply.voltage.unit")} units={unitsByDimension.voltage} error={errorAt(errors, "supply.voltage")} />
        )}
      </fieldset>
      <SupplyPreview parts={parts} chosen={watchedParts} supply={watchedSupply} voltage={watchedVoltage} />

      <fieldset className="grid gap-3 sm:grid-cols-3">
        <legend className="mb-1 text-sm font-medium text-graphite-700">Measurements (leave blank what was not measured)</legend>
        {measurementSymbols.map((symbol) => {
          const planned = quantityName(symbol);
          return (
            <QuantityField
              key={symbol}
              label={measurementLabels[symbol]}
              valueProps={form.register(`measurements.${symbol}.value`)}
              unitProps={form.register(`measurements.${symbol}.unit`)}
              units={unitsByDimension[measurementDimensions[symbol]]}
              error={errorAt(errors, `measurements.${symbol}`)}
              hint={symbol === "mass" ? "Blank: the shelf masses of the parts are added up." : planned ? `${planned.name} (${planned.symbol})` : undefined}
            />
          );
        })}
      </fieldset>
      <TextAreaField label="Notes" {...form.register("notes")} error={errors.notes?.message} />
      {problem && <Notice kind="error">{problem}</Notice>}
      <FormActions submit={run ? "Save changes" : "Save run"} busy={add.isPending || update.isPending} onCancel={onDone} />
    </form>
  );
}

/** What the chosen supply means before saving: the pack's voltages and any part it would over-volt. */
function SupplyPreview({ parts, chosen, supply, voltage }: { parts: PartView[]; chosen: RunFormValues["parts"]; supply: RunFormValues["supply"]; voltage: QuantityText }) {
  const pack = supply.kind === "lipo" && cellCountSchema.safeParse(Number(supply.cells)).success ? lipoPack(Number(supply.cells)) : null;
  const typed = (text: QuantityText): Quantity | undefined => {
    const parsed = quantitySchema.safeParse({ value: Number(text.value), unit: text.unit });
    return text.value.trim() !== "" && parsed.success ? parsed.data : undefined;
  };
  const supplyValue: Supply | null = pack ? { kind: "lipo", cells: pack.cells } : supply.kind === "bench" && typed(supply.voltage) ? { kind: "bench", voltage: typed(supply.voltage)! } : null;
  let highest: Quantity | null = null;
  try {
    highest = highestSupplyVoltage(supplyValue, typed(voltage));
  } catch {
    highest = null;
  }
  const overRated = highest
    ? chosen.flatMap((choice) => {
        const part = parts.find((p) => p.id === choice.partId);
        if (!part?.ratedVoltage) return [];
        const check = checkVoltageRating(highest, part.ratedVoltage);
        return check.status === "over_rated" ? [{ part, check }] : [];
      })
    : [];
  return (
    <div className="flex flex-col gap-2" aria-live="polite">
      {pack && (
        <Caution title={`${pack.label} LiPo: ${formatQuantity(pack.nominal)} nominal, ${formatQuantity(pack.full)} full`}>
          <p>{pack.caution}</p>
          <p className="mt-1 text-xs">Per cell 3.7 V nominal and 4.2 V full (the usual figures for lithium-polymer cells; the pack's own label wins).</p>
        </Caution>
      )}
      {overRated.map(({ part, check }) => (
        <Caution key={part.id} title={`Over-rated: ${part.name}`}>
          {check.caution}
        </Caution>
      ))}
    </div>
  );
}
