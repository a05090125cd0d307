import { useState } from "react";
import { useForm, useWatch } from "react-hook-form";
import { describeCriterion, metricLabels, unitsForMetric } from "@shared/bench/format";
import { type MetricName, figureNames, metricNames, metricUnit } from "@shared/bench/metrics";
import type { CriterionInput, CriterionView } from "@shared/bench/schemas";
import { RATIO_UNIT } from "@shared/bench/units";
import { Button } from "../../../components/Button";
import { FormOpener } from "../../../components/FormOpener";
import { Notice } from "../../../components/Notice";
import { Empty } from "../../../components/States";
import { useOpenedRecord } from "../../../lib/conflicts";
import { useAddCriterion } from "../api/add-criterion";
import { useDeleteCriterion } from "../api/delete-criterion";
import { useUpdateCriterion } from "../api/update-criterion";
import { Panel } from "./marks";
import { CheckboxField, FormActions, QuantityField, SelectField, TextField } from "../../../components/form-fields";
import { type QuantityText, applyServerErrors, converter, errorAt, quantityText } from "../../../lib/forms";
import { lazySchemaResolver } from "../../../lib/lazy-schema-resolver";
import { benchSchemas } from "../schemas-later";

type Comparator = CriterionInput["comparator"];

interface CriterionFormValues {
  metric: MetricName;
  comparator: Comparator;
  threshold: QuantityText;
  tolerance: QuantityText;
  low: QuantityText;
  high: QuantityText;
  required: boolean;
  note: string;
}

const derived = new Set<string>(figureNames);
const metricOptions = metricNames.map((metric) => ({ value: metric, label: derived.has(metric) ? `${metricLabels[metric]} (derived)` : `${metricLabels[metric]} (measured)` }));
const comparatorOptions: { value: Comparator; label: string }[] = [
  { value: "gte", label: "at least (≥)" },
  { value: "lte", label: "at most (≤)" },
  { value: "eq", label: "equal, within a tolerance (=)" },
  { value: "between", label: "between two bounds" },
];

function toValues(criterion?: CriterionInput): CriterionFormValues {
  const metric = criterion?.metric ?? "thrust_to_weight";
  const unit = metricUnit(metric);
  const blank = { value: "", unit };
  const values: CriterionFormValues = { metric, comparator: criterion?.comparator ?? "gte", threshold: blank, tolerance: blank, low: blank, high: blank, required: criterion?.required ?? true, note: criterion?.note ?? "" };
  if (!criterion) return values;
  if (criterion.comparator === "between") return { ...values, low: quantityText(criterion.low, unit), high: quantityText(criterion.high, unit) };
  const withThreshold = { ...values, threshold: quantityText(criterion.threshold, unit) };
  return criterion.comparator === "eq" ? { ...withThreshold, tolerance: quantityText(criterion.tolerance, unit) } : withThreshold;
}

function toInput(values: CriterionFormValues, read = converter()) {
  const base = { metric: values.metric, comparator: values.comparator, required: values.required, ...(values.note.trim() ? { note: values.note.trim() } : {}) };
  const input =
    values.comparator === "between"
      ? { ...base, low: read.quantity(values.low, "low", true), high: read.quantity(values.high, "high", true) }
      : values.comparator === "eq"
        ? { ...base, threshold: read.quantity(values.threshold, "threshold", true), tolerance: read.quantity(values.tolerance, "tolerance", true) }
        : { ...base, threshold: read.quantity(values.threshold, "threshold", true) };
  return input;
}

const criterionResolver = lazySchemaResolver(async () => (await benchSchemas()).criterionInputSchema, toInput);

const formFields = ["metric", "comparator", "threshold", "threshold.value", "threshold.unit", "tolerance", "tolerance.value", "tolerance.unit", "low", "low.value", "low.unit", "high", "high.value", "high.unit", "note"] as const;

export function CriteriaPanel({ channelId, episodeId, criteria, canWrite }: { channelId: string; episodeId: string; criteria: CriterionView[]; canWrite: boolean }) {
  const [editing, setEditing] = useState<string | null>(null);
  const remove = useDeleteCriterion(channelId, episodeId);
  const required = criteria.filter((criterion) => criterion.required).length;
  return (
    <Panel>
      <h3 className="font-semibold">Pass criteria</h3>
      <p className="mb-3 text-sm text-graphite-500">A run meets the plan only when every required criterion passes; informative ones are shown but do not decide.</p>
      {criteria.length === 0 ? (
        <Empty title="No pass criteria yet">{canWrite ? "Add one, such as thrust-to-weight at least 1.2." : "The owner or producer adds them."}</Empty>
      ) : (
        <ol className="mb-4 divide-y divide-ply-200 rounded-md border border-ply-200">
          {criteria.map((criterion, index) =>
            editing === criterion.id ? (
              <li key={criterion.id} className="p-3">
                <CriterionForm channelId={channelId} episodeId={episodeId} criterion={criterion} onDone={() => setEditing(null)} />
              </li>
            ) : (
              <li key={criterion.id} className="flex flex-wrap items-center gap-3 px-3 py-2">
                <span className="w-6 text-sm text-graphite-500">{index + 1}.</span>
                <span className="flex-1 font-medium">
                  {describeCriterion(criterion)}
                  {criterion.note && <span className="block text-xs font-normal text-graphite-500">{criterion.note}</span>}
                </span>
                <span className={`rounded-full px-2 py-0.5 text-xs ${criterion.required ? "bg-graphite-900 text-white" : "bg-ply-200 text-graphite-700"}`}>{criterion.required ? "required" : "informative"}</span>
                {canWrite && (
                  <>
                    <Button tone="quiet" onClick={() => setEditing(criterion.id)} aria-label={`Edit criterion ${index + 1}`}>
                      Edit
                    </Button>
                    <Button tone="danger" busy={remove.isPending && remove.variables === criterion.id} onClick={() => remove.mutate(criterion.id)} aria-label={`Remove criterion ${index + 1}`}>
                      Remove
                    </Button>
                  </>
                )}
              </li>
            ),
          )}
        </ol>
      )}
      {criteria.length > 0 && required === 0 && <Notice kind="info">None of these is required, so no run can meet the plan yet, and leaving the test plan stage will ask for a reason.</Notice>}
      {canWrite && editing === null && (
        <FormOpener label="Add a criterion" className="mt-4">
          {(close) => (
            <div className="border-t border-ply-200 pt-4">
              <h4 className="mb-2 text-sm font-semibold">New criterion</h4>
              <CriterionForm channelId={channelId} episodeId={episodeId} onDone={close} />
            </div>
          )}
        </FormOpener>
      )}
    </Panel>
  );
}

function CriterionForm({ channelId, episodeId, criterion, onDone }: { channelId: string; episodeId: string; criterion?: CriterionView; onDone?: () => void }) {
  const add = useAddCriterion(channelId, episodeId);
  const update = useUpdateCriterion(channelId, episodeId);
  const [problem, setProblem] = useState<string | null>(null);
  const form = useForm<CriterionFormValues, unknown, CriterionInput>({ resolver: criterionResolver, defaultValues: toValues(criterion) });
  const record = useOpenedRecord<CriterionView>(criterion ?? null, (current) => form.reset(toValues(current)));
  const [metric, comparator] = useWatch({ control: form.control, name: ["metric", "comparator"] });
  const errors = form.formState.errors;
  const suggestions = unitsForMetric(metric);
  const unitHint = metricUnit(metric) === RATIO_UNIT ? "A plain ratio: write the unit as 1." : `In ${suggestions.join(", ")}.`;

  const onSubmit = form.handleSubmit(async (input) => {
    setProblem(null);
    try {
      if (criterion) await update.mutateAsync({ id: criterion.id, input, version: record.version });
      else await add.mutateAsync(input);
      form.reset(toValues());
      onDone?.();
    } catch (error) {
      const message = record.conflictIn(error) ?? applyServerErrors(error, form.setError, formFields);
      if (message) setProblem(message);
    }
  });

  const quantity = (name: "threshold" | "tolerance" | "low" | "high", label: string) => (
    <QuantityField label={label} valueProps={form.register(`${name}.value`)} unitProps={form.register(`${name}.unit`)} units={suggestions} freeUnit error={errorAt(errors, name)} hint={unitHint} />
  );

  return (
    <form onSubmit={onSubmit} noValidate aria-label={criterion ? "Edit criterion" : "New criterion"} className="flex flex-col gap-3">
      <div className="grid gap-3 sm:grid-cols-2">
        <SelectField
          label="Metric"
          options={metricOptions}
          {...form.register("metric", {
            onChange: (event) => {
              const unit = metricUnit(event.target.value as MetricName);
              for (const name of ["threshold", "tolerance", "low", "high"] as const) form.setValue(`${name}.unit`, unit);
            },
          })}
        />
        <SelectField label="Comparison" options={comparatorOptions} {...form.register("comparator")} />
      </div>
      <div className="grid gap-3 sm:grid-cols-2">
        {comparator === "between" ? (
          <>
            {quantity("low", "From")}
            {quantity("high", "To")}
          </>
        ) : (
          <>
            {quantity("threshold", "Threshold")}
            {comparator === "eq" && quantity("tolerance", "Tolerance (±)")}
          </>
        )}
      </div>
      <TextField label="Note (optional)" {...form.register("note")} error={errors.note?.message} />
      <CheckboxField label="Required" hint="A required criterion decides the verdict; an informative one is only shown." {...form.register("required")} />
      {problem && <Notice kind="error">{problem}</Notice>}
      <FormActions submit={criterion ? "Save criterion" : "Add criterion"} busy={add.isPending || update.isPending} onCancel={onDone} />
    </form>
  );
}
