import { useState } from "react";
import { useForm, useWatch } from "react-hook-form";
import { unitsByDimension } from "@shared/bench/quantity";
import { partInputSchema, partKindLabels, partKinds, type PartInput, type PartKind, type PartView } from "@shared/bench/schemas";
import { Notice } from "../../../components/Notice";
import { CheckboxField, FormActions, QuantityField, SelectField, TextAreaField, TextField } from "../../../components/form-fields";
import { useOpenedRecord } from "../../../lib/conflicts";
import { type QuantityText, applyServerErrors, converter, errorAt, quantityText } from "../../../lib/forms";
import { schemaResolver } from "../../../lib/schema-resolver";

interface PartFormValues {
  name: string;
  kind: PartKind;
  powered: boolean;
  mass: QuantityText;
  ratedVoltage: QuantityText;
  ratedCurrent: QuantityText;
  price: { amount: string; currency: string };
  supplier: string;
  notes: string;
}

const toValues = (part?: PartView): PartFormValues => ({
  name: part?.name ?? "",
  kind: part?.kind ?? "motor",
  powered: part?.powered ?? true,
  mass: quantityText(part?.mass, "g"),
  ratedVoltage: quantityText(part?.ratedVoltage, "V"),
  ratedCurrent: quantityText(part?.ratedCurrent, "A"),
  price: { amount: part?.price?.amount ?? "", currency: part?.price?.currency ?? "EUR" },
  supplier: part?.supplier ?? "",
  notes: part?.notes ?? "",
});

function toInput(values: PartFormValues, read = converter()) {
  const amount = values.price.amount.trim().replace(/^(\d+),(\d{1,2})$/, "$1.$2");
  const input = {
    name: values.name,
    kind: values.kind,
    powered: values.powered,
    mass: read.quantity(values.mass, "mass"),
    // A part that takes no power has no rated voltage: the hidden field's text is not sent.
    ratedVoltage: values.powered ? read.quantity(values.ratedVoltage, "ratedVoltage") : null,
    ratedCurrent: read.quantity(values.ratedCurrent, "ratedCurrent"),
    price: amount ? { amount, currency: values.price.currency.trim().toUpperCase() } : null,
    supplier: values.supplier,
    notes: values.notes,
  };
  return input;
}

const fields = ["name", "kind", "powered", "mass", "mass.value", "ratedVoltage", "ratedVoltage.value", "ratedCurrent", "ratedCurrent.value", "price.amount", "price.currency", "supplier", "notes"] as const;

/** A new part, or a change of one against the version the form opened with (`onSave`'s second argument). */
export function PartForm({ part, busy, onSave, onCancel }: { part?: PartView; busy: boolean; onSave: (input: PartInput, version: number) => Promise<unknown>; onCancel?: () => void }) {
  const [problem, setProblem] = useState<string | null>(null);
  const form = useForm<PartFormValues, unknown, PartInput>({ resolver: schemaResolver(partInputSchema, toInput), defaultValues: toValues(part) });
  const record = useOpenedRecord<PartView>(part ?? null, (current) => form.reset(toValues(current)));
  const errors = form.formState.errors;
  const powered = useWatch({ control: form.control, name: "powered" });

  const onSubmit = form.handleSubmit(async (input) => {
    setProblem(null);
    try {
      await onSave(input, record.version);
      if (!part) form.reset(toValues());
    } catch (error) {
      const message = record.conflictIn(error) ?? applyServerErrors(error, form.setError, fields);
      if (message) setProblem(message);
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate aria-label={part ? `Edit ${part.name}` : "New part"} className="flex flex-col gap-3">
      <div className="grid gap-3 sm:grid-cols-[2fr_1fr]">
        <TextField label="Name" placeholder="e.g. 2216 outrunner, 880 kV" {...form.register("name")} error={errors.name?.message} />
        <SelectField label="Kind" options={partKinds.map((kind) => ({ value: kind, label: partKindLabels[kind] }))} {...form.register("kind")} error={errors.kind?.message} />
      </div>
      <CheckboxField label="Takes power" hint="Untick for a part that is never wired up (a frame, a propeller, a passive fan): it needs no rated voltage." {...form.register("powered")} />
      <div className="grid items-start gap-3 sm:grid-cols-3">
        <QuantityField label="Mass" valueProps={form.register("mass.value")} unitProps={form.register("mass.unit")} units={unitsByDimension.mass} error={errorAt(errors, "mass")} />
        {powered && (
          <QuantityField
            label="Rated voltage"
            valueProps={form.register("ratedVoltage.value")}
            unitProps={form.register("ratedVoltage.unit")}
            units={unitsByDimension.voltage}
            error={errorAt(errors, "ratedVoltage")}
            hint="The maker's maximum; runs above it are flagged."
          />
        )}
        <QuantityField label="Rated current" valueProps={form.register("ratedCurrent.value")} unitProps={form.register("ratedCurrent.unit")} units={unitsByDimension.current} error={errorAt(errors, "ratedCurrent")} />
      </div>
      <div className="grid items-start gap-3 sm:grid-cols-[1fr_6rem_2fr]">
        <TextField label="Price" inputMode="decimal" {...form.register("price.amount")} error={errorAt(errors, "price.amount")} />
        <TextField label="Currency" maxLength={3} {...form.register("price.currency")} error={errorAt(errors, "price.currency")} />
        <TextField label="Supplier" {...form.register("supplier")} error={errors.supplier?.message} />
      </div>
      <TextAreaField label="Notes" {...form.register("notes")} error={errors.notes?.message} />
      {problem && <Notice kind="error">{problem}</Notice>}
      <FormActions submit={part ? "Save part" : "Add to the shelf"} busy={busy} onCancel={onCancel} />
    </form>
  );
}
