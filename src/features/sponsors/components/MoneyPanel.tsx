import { useState } from "react";
import { useForm } from "react-hook-form";
import { moneySchema, paymentTermsFrom, paymentTermsLabels, type DealView, type Money } from "@shared/sponsors/schemas";
import { Button } from "../../../components/Button";
import { Notice } from "../../../components/Notice";
import { useOpenedRecord } from "../../../lib/conflicts";
import { useUpdateMoney } from "../api/update-money";
import { formatDay, formatMoney } from "../../../lib/format";
import { FormActions, SelectField, TextField } from "../../../components/form-fields";
import { applyServerErrors, numberFrom } from "../../../lib/forms";
import { schemaResolver } from "../../../lib/schema-resolver";

interface MoneyForm {
  fee: string;
  currency: string;
  paymentTermsDays: string;
  paymentTermsFrom: string;
  invoiceNumber: string;
  invoicedOn: string;
  paidOn: string;
}

const moneyValues = (value: Money): MoneyForm => ({
  fee: String(value.fee),
  currency: value.currency,
  paymentTermsDays: String(value.paymentTermsDays),
  paymentTermsFrom: value.paymentTermsFrom,
  invoiceNumber: value.invoiceNumber ?? "",
  invoicedOn: value.invoicedOn ?? "",
  paidOn: value.paidOn ?? "",
});

const names = ["fee", "currency", "paymentTermsDays", "paymentTermsFrom", "invoiceNumber", "invoicedOn", "paidOn"];

/** The fee, its terms and the invoice: only owners and producers ever receive these from the API. */
export function MoneyPanel({ channelId, deal, value }: { channelId: string; deal: DealView; value: Money }) {
  const [editing, setEditing] = useState(false);
  const update = useUpdateMoney(channelId, deal.id);
  const [formError, setFormError] = useState<string | null>(null);
  const form = useForm<MoneyForm, unknown, Money>({
    resolver: schemaResolver(moneySchema, (v: MoneyForm) => ({ ...v, fee: v.fee, paymentTermsDays: numberFrom(v.paymentTermsDays) })),
    defaultValues: moneyValues(value),
  });
  // The deal as the form opened: the save is made against its version.
  const record = useOpenedRecord(deal, (current) => current.money && form.reset(moneyValues(current.money)));
  const errors = form.formState.errors;
  const open = () => {
    record.startFrom(deal);
    setFormError(null);
    setEditing(true);
  };
  const onSubmit = form.handleSubmit(async (body) => {
    setFormError(null);
    try {
      await update.mutateAsync({ ...body, version: record.version });
      setEditing(false);
    } catch (error) {
      setFormError(record.conflictIn(error) ?? applyServerErrors(error, form.setError, names));
    }
  });

  if (!editing) {
    return (
      <div className="flex flex-wrap items-center gap-4 text-sm">
        <p data-testid="deal-fee">
          <span className="text-graphite-500">Fee</span> <strong>{formatMoney(value.fee, value.currency)}</strong>
        </p>
        <p>
          <span className="text-graphite-500">Paid</span> {value.paymentTermsDays} days {paymentTermsLabels[value.paymentTermsFrom]}
        </p>
        <p>
          <span className="text-graphite-500">Invoice</span> {value.invoiceNumber ? `${value.invoiceNumber}${value.invoicedOn ? ` of ${formatDay(value.invoicedOn)}` : ""}` : "not yet"}
          {value.paidOn ? `, paid ${formatDay(value.paidOn)}` : ""}
        </p>
        <Button tone="quiet" className="px-2 py-1" onClick={open}>
          Edit money
        </Button>
      </div>
    );
  }
  return (
    <form onSubmit={onSubmit} noValidate aria-label="Money" className="grid gap-3 sm:grid-cols-4">
      {formError && (
        <div className="sm:col-span-4">
          <Notice kind="error">{formError}</Notice>
        </div>
      )}
      <TextField label="Fee" inputMode="decimal" {...form.register("fee")} error={errors.fee?.message} />
      <TextField label="Currency" maxLength={3} {...form.register("currency")} error={errors.currency?.message} />
      <TextField label="Payment terms (days)" inputMode="numeric" {...form.register("paymentTermsDays")} error={errors.paymentTermsDays?.message} />
      <SelectField label="Counted from" options={paymentTermsFrom.map((p) => ({ value: p, label: paymentTermsLabels[p] }))} {...form.register("paymentTermsFrom")} error={errors.paymentTermsFrom?.message} />
      <TextField label="Invoice number" {...form.register("invoiceNumber")} error={errors.invoiceNumber?.message} />
      <TextField label="Invoiced on" type="date" {...form.register("invoicedOn")} error={errors.invoicedOn?.message} />
      <TextField label="Paid on" type="date" {...form.register("paidOn")} error={errors.paidOn?.message} />
      <FormActions className="flex items-end gap-2" submit="Save" busy={update.isPending} onCancel={() => setEditing(false)} />
    </form>
  );
}
