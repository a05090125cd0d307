import { useState } from "react";
import { useFieldArray, useForm, useWatch } from "react-hook-form";
import { roleMay } from "@shared/access/roles";
import { formatQuantity } from "@shared/bench/format";
import { measurementDimensions, measurementLabels, measurementSymbols } from "@shared/bench/metrics";
import type { TestPlanInput, TestPlanView } from "@shared/bench/schemas";
import { unitsByDimension } from "@shared/bench/units";
import { Button } from "../../../components/Button";
import { Notice } from "../../../components/Notice";
import { QueryState } from "../../../components/States";
import type { EpisodeSectionProps } from "../../../lib/episode-sections";
import { useOpenedRecord } from "../../../lib/conflicts";
import { useTestPlan } from "../api/get-test-plan";
import { useSaveTestPlan } from "../api/save-test-plan";
import { CriteriaPanel } from "./CriteriaPanel";
import { Panel } from "./marks";
import { SafetyPanel } from "./SafetyPanel";
import { QuantityField, SelectField, TextAreaField, TextField } from "../../../components/form-fields";
import { type QuantityText, applyServerErrors, converter, errorAt, quantityText } from "../../../lib/forms";
import { lazySchemaResolver } from "../../../lib/lazy-schema-resolver";
import { benchSchemas } from "../schemas-later";

/** The episode page's test plan sheet: the question made testable, its pass criteria and its safety list. */
export function TestPlanSheet({ channelId, episodeId, role }: EpisodeSectionProps) {
  const plan = useTestPlan(channelId, episodeId);
  const canWrite = roleMay(role, "testPlan", "W");
  return (
    <QueryState query={plan} loading="Loading the test plan…">
      {(sheet) => (
        <div className="flex flex-col gap-6">
          {canWrite ? <PlanForm channelId={channelId} episodeId={episodeId} plan={sheet} /> : <PlanReadOnly plan={sheet} />}
          <CriteriaPanel channelId={channelId} episodeId={episodeId} criteria={sheet.criteria} canWrite={canWrite} />
          <SafetyPanel channelId={channelId} episodeId={episodeId} hazards={sheet.hazards} canWrite={canWrite} canCheck={roleMay(role, "safetyChecks", "W")} />
        </div>
      )}
    </QueryState>
  );
}

function PlanReadOnly({ plan }: { plan: TestPlanView }) {
  return (
    <Panel>
      <dl className="grid gap-4 text-sm sm:grid-cols-[10rem_1fr]">
        <dt className="text-graphite-500">Hypothesis</dt>
        <dd className="whitespace-pre-wrap">{plan.hypothesis || <span className="text-graphite-500">Not written yet.</span>}</dd>
        <dt className="text-graphite-500">Method</dt>
        <dd className="whitespace-pre-wrap">{plan.method || <span className="text-graphite-500">Not written yet.</span>}</dd>
        <dt className="text-graphite-500">Airframe mass</dt>
        <dd>{plan.airframeMass ? formatQuantity(plan.airframeMass) : <span className="text-graphite-500">Not weighed yet.</span>}</dd>
        <dt className="text-graphite-500">Quantities</dt>
        <dd>
          {plan.quantities.length === 0 ? (
            <span className="text-graphite-500">None listed.</span>
          ) : (
            <ul>
              {plan.quantities.map((quantity, index) => (
                <li key={index}>
                  {quantity.name} (<i>{quantity.symbol}</i>, {quantity.unit})
                </li>
              ))}
            </ul>
          )}
        </dd>
      </dl>
      <p className="mt-4 text-xs text-graphite-500">Only the owner and producer change the test plan.</p>
    </Panel>
  );
}

interface PlanFormValues {
  hypothesis: string;
  method: string;
  quantities: { name: string; symbol: string; measures: (typeof measurementSymbols)[number]; unit: string }[];
  airframeMass: QuantityText;
}

const toValues = (plan: TestPlanView): PlanFormValues => ({
  hypothesis: plan.hypothesis,
  method: plan.method,
  quantities: plan.quantities.map((quantity) => ({ ...quantity })),
  airframeMass: quantityText(plan.airframeMass, "g"),
});

const toInput = (values: PlanFormValues, read = converter()) => ({
  hypothesis: values.hypothesis,
  method: values.method,
  quantities: values.quantities,
  airframeMass: read.quantity(values.airframeMass, "airframeMass"),
});

const planResolver = lazySchemaResolver(async () => (await benchSchemas()).testPlanInputSchema, toInput);

const measureOptions = measurementSymbols.map((symbol) => ({ value: symbol, label: measurementLabels[symbol] }));
const unitsOf = (measures: (typeof measurementSymbols)[number]) => unitsByDimension[measurementDimensions[measures]];

function PlanForm({ channelId, episodeId, plan }: { channelId: string; episodeId: string; plan: TestPlanView }) {
  const save = useSaveTestPlan(channelId, episodeId);
  const [notice, setNotice] = useState<{ kind: "error" | "success"; text: string } | null>(null);
  const form = useForm<PlanFormValues, unknown, TestPlanInput>({ resolver: planResolver, defaultValues: toValues(plan) });
  // The sheet as this form opened it: a save is made against its version (0 before the first save).
  const record = useOpenedRecord(plan, (current) => form.reset(toValues(current)));
  const quantities = useFieldArray({ control: form.control, name: "quantities" });
  const measures = useWatch({ control: form.control, name: "quantities" });
  const errors = form.formState.errors;

  const onSubmit = form.handleSubmit(async (input) => {
    setNotice(null);
    try {
      record.startFrom(await save.mutateAsync({ ...input, version: record.version }));
      setNotice({ kind: "success", text: "Test plan saved." });
    } catch (error) {
      const message = record.conflictIn(error) ?? applyServerErrors(error, form.setError, ["hypothesis", "method", "airframeMass", "airframeMass.value", "airframeMass.unit"]);
      if (message) setNotice({ kind: "error", text: message });
    }
  });

  return (
    <Panel>
      <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4" aria-label="Test plan">
        <TextAreaField label="Hypothesis" placeholder="What you expect, stated so a measurement can prove it wrong." {...form.register("hypothesis")} error={errors.hypothesis?.message} />
        <TextAreaField label="Method" placeholder="How each candidate is set up, run and read." {...form.register("method")} error={errors.method?.message} />
        <div className="max-w-xs">
          <QuantityField
            label="Airframe mass"
            valueProps={form.register("airframeMass.value")}
            unitProps={form.register("airframeMass.unit")}
            units={unitsByDimension.mass}
            error={errorAt(errors, "airframeMass")}
            hint="The craft without the parts under test; each run adds its own parts for the all-up mass."
          />
        </div>

        <fieldset className="flex flex-col gap-2">
          <legend className="mb-1 text-sm font-medium text-graphite-700">Quantities to measure</legend>
          {quantities.fields.length === 0 && <p className="text-sm text-graphite-500">None yet. List what the bench will read, with the unit you will read it in.</p>}
          {quantities.fields.map((field, index) => (
            <div key={field.id} className="grid items-start gap-2 sm:grid-cols-[1fr_5rem_9rem_6rem_auto]">
              <TextField label="Name" {...form.register(`quantities.${index}.name`)} error={errorAt(errors, `quantities.${index}.name`)} />
              <TextField label="Symbol" {...form.register(`quantities.${index}.symbol`)} error={errorAt(errors, `quantities.${index}.symbol`)} />
              <SelectField
                label="Measures"
                options={measureOptions}
                {...form.register(`quantities.${index}.measures`, {
                  onChange: (event) => form.setValue(`quantities.${index}.unit`, unitsOf(event.target.value)[0]),
                })}
              />
              <SelectField
                label="Unit"
                options={unitsOf(measures[index]?.measures ?? field.measures).map((unit) => ({ value: unit, label: unit }))}
                {...form.register(`quantities.${index}.unit`)}
                error={errorAt(errors, `quantities.${index}.unit`)}
              />
              <Button type="button" tone="quiet" className="sm:mt-6" onClick={() => quantities.remove(index)} aria-label={`Remove quantity ${index + 1}`}>
                Remove
              </Button>
            </div>
          ))}
          <div>
            <Button type="button" tone="quiet" onClick={() => quantities.append({ name: "", symbol: "", measures: "thrust", unit: "gf" })}>
              Add a quantity
            </Button>
          </div>
        </fieldset>

        <div className="flex items-center gap-3">
          <Button type="submit" busy={save.isPending}>
            Save the test plan
          </Button>
          {form.formState.isDirty && <span className="text-xs text-graphite-500">Unsaved changes</span>}
        </div>
        {notice && <Notice kind={notice.kind}>{notice.text}</Notice>}
      </form>
    </Panel>
  );
}
