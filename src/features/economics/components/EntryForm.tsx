import { useForm, useWatch } from "react-hook-form";
import { type EpisodeMoneyView, entryKindLabels, entryKinds, type EntryKind, type NewEntry, type NewEntryInput, newEntrySchema, purchaseCategories, purchaseCategoryLabels } from "@shared/economics/schemas";
import { commonCurrencies } from "@shared/slate/schemas";
import { FormActions, NumberField, SelectField, TextField } from "../../../components/form-fields";
import { Notice } from "../../../components/Notice";
import { applyServerErrors } from "../../../lib/forms";
import { formatMinorMoney } from "../../../lib/format";
import { schemaResolver } from "../../../lib/schema-resolver";
import { useAddEntry } from "../api/add-entry";

interface EntryFields {
  kind: EntryKind;
  partId: string;
  quantity: string;
  category: string;
  label: string;
  source: string;
  amount: string;
  currency: string;
  rate: string;
  memberId: string;
  hours: string;
  occurredOn: string;
}
const fieldNames = ["kind", "partId", "quantity", "category", "label", "source", "amount", "currency", "rate", "memberId", "hours", "occurredOn"] as const;

/** What the server takes for each kind of line, from the form's text. */
function toBody(values: EntryFields) {
  const dated = { occurredOn: values.occurredOn, rate: values.rate };
  switch (values.kind) {
    case "part":
      return { kind: "part", partId: values.partId, quantity: values.quantity.trim() === "" ? Number.NaN : Number(values.quantity), ...dated };
    case "purchase":
      return { kind: "purchase", category: values.category, label: values.label, source: values.source, amount: values.amount, currency: values.currency, ...dated };
    case "income":
      return { kind: "income", label: values.label, amount: values.amount, currency: values.currency, ...dated };
    case "hours":
      return { kind: "hours", memberId: values.memberId, label: values.label, hours: values.hours, occurredOn: values.occurredOn };
  }
}

const today = () => new Date().toISOString().slice(0, 10);

export function EntryForm({ channelId, episodeId, money, onDone }: { channelId: string; episodeId: string; money: EpisodeMoneyView; onDone: () => void }) {
  const channelCurrency = money.settings.currency;
  const add = useAddEntry(channelId, episodeId);
  const form = useForm<EntryFields, unknown, NewEntry>({
    resolver: schemaResolver(newEntrySchema, toBody),
    defaultValues: { kind: "purchase", partId: money.parts[0]?.id ?? "", quantity: "1", category: "materials", label: "", source: "", amount: "", currency: channelCurrency, rate: "", memberId: money.members[0]?.id ?? "", hours: "", occurredOn: today() },
  });
  const { errors } = form.formState;
  const [kind, partId, currency] = useWatch({ control: form.control, name: ["kind", "partId", "currency"] });
  const part = money.parts.find((p) => p.id === partId);
  const lineCurrency = kind === "part" ? (part?.currency ?? channelCurrency) : currency;
  const needsRate = kind !== "hours" && lineCurrency !== channelCurrency;
  const currencies = [...new Set([channelCurrency, ...commonCurrencies])].map((c) => ({ value: c, label: c }));

  // The body is the form's text as the schema reads it; the resolver has checked it already.
  const submit = form.handleSubmit(async () => {
    try {
      await add.mutateAsync(toBody(form.getValues()) as NewEntryInput);
      onDone();
    } catch (error) {
      const message = applyServerErrors(error, form.setError, fieldNames);
      if (message) form.setError("root", { type: "server", message });
    }
  });

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-3" aria-label="Add a line">
      <div className="grid grid-cols-1 gap-3 sm:grid-cols-3">
        <SelectField label="What it is" options={entryKinds.map((k) => ({ value: k, label: entryKindLabels[k] }))} {...form.register("kind")} error={errors.kind?.message} />
        <TextField label="On" type="date" {...form.register("occurredOn")} error={errors.occurredOn?.message} />
      </div>
      {kind === "part" &&
        (money.parts.length === 0 ? (
          <Notice>No part on the shelf has a price yet. Add prices on the shelf, or record the part as another purchase.</Notice>
        ) : (
          <div className="grid grid-cols-1 gap-3 sm:grid-cols-3">
            <SelectField
              label="Part from the shelf"
              options={money.parts.map((p) => ({ value: p.id, label: `${p.name}, ${formatMinorMoney(p.priceMinor, p.currency)}${p.supplier ? ` from ${p.supplier}` : ""}` }))}
              {...form.register("partId")}
              error={errors.partId?.message}
            />
            <NumberField whole label="How many were used" {...form.register("quantity")} error={errors.quantity?.message} />
          </div>
        ))}
      {kind === "purchase" && (
        <div className="grid grid-cols-1 gap-3 sm:grid-cols-3">
          <SelectField label="Kind of purchase" options={purchaseCategories.map((c) => ({ value: c, label: purchaseCategoryLabels[c] }))} {...form.register("category")} error={errors.category?.message} />
          <TextField label="What was bought" {...form.register("label")} error={errors.label?.message} />
          <TextField label="Where it was bought" hint="Optional" {...form.register("source")} error={errors.source?.message} />
        </div>
      )}
      {kind === "income" && <TextField label="Where the income is from" {...form.register("label")} error={errors.label?.message} />}
      {(kind === "purchase" || kind === "income") && (
        <div className="grid grid-cols-1 gap-3 sm:grid-cols-3">
          <NumberField label="Amount" {...form.register("amount")} error={errors.amount?.message} />
          <SelectField label="Currency" options={currencies} {...form.register("currency")} error={errors.currency?.message} />
        </div>
      )}
      {kind === "hours" && (
        <div className="grid grid-cols-1 gap-3 sm:grid-cols-3">
          <SelectField label="Member" options={money.members.map((m) => ({ value: m.id, label: m.name }))} {...form.register("memberId")} error={errors.memberId?.message} />
          <TextField label="Hours" hint="2.5 or 2:30" inputMode="decimal" {...form.register("hours")} error={errors.hours?.message} />
          <TextField label="On what" hint="Optional" {...form.register("label")} error={errors.label?.message} />
        </div>
      )}
      {needsRate && (
        <NumberField
          label={`Rate that day: one ${lineCurrency} in ${channelCurrency}`}
          hint="As your bank or receipt gave it; Kerf never looks rates up."
          {...form.register("rate")}
          error={errors.rate?.message}
        />
      )}
      {errors.root?.message && <Notice kind="error">{errors.root.message}</Notice>}
      <FormActions submit="Add the line" busy={add.isPending} onCancel={onDone} />
    </form>
  );
}
