import { useEffect, useRef, useState } from "react";
import { useQueryClient } from "@tanstack/react-query";
import { useForm } from "react-hook-form";
import { invoiceStageLabels, newInvoiceSchema, type InvoiceAction, type InvoiceStage, type InvoiceView, type NewInvoiceInput } from "@shared/sponsors/invoices";
import { Button } from "../../../components/Button";
import { FormActions, TextField } from "../../../components/form-fields";
import { Notice } from "../../../components/Notice";
import { QueryState } from "../../../components/States";
import { formatDay, formatMinorMoney } from "../../../lib/format";
import { ApiError } from "../../../lib/api-client";
import { applyServerErrors } from "../../../lib/forms";
import { schemaResolver } from "../../../lib/schema-resolver";
import { useInvoiceAction } from "../api/act-on-invoice";
import { useCreateInvoice } from "../api/create-invoice";
import { sponsorKeys } from "../api/keys";
import { useInvoices } from "../api/list-invoices";

const stageTone: Record<InvoiceStage, string> = {
  draft: "border border-dashed border-graphite-500 text-graphite-700",
  finalised: "bg-ply-200 text-graphite-900",
  sent: "bg-amber-cut text-graphite-900",
  paid: "bg-moss-600 text-white",
  void: "bg-ply-100 text-graphite-700 line-through",
  uncollectible: "border border-rust-600 text-rust-700",
};

/** The next steps an invoice offers, in the order a producer takes them. */
const stepsOf: Record<InvoiceStage, { action: InvoiceAction; label: string; tone: "primary" | "quiet" | "danger" }[]> = {
  draft: [
    { action: "finalise", label: "Finalise", tone: "primary" },
    { action: "void", label: "Discard", tone: "danger" },
  ],
  finalised: [
    { action: "send", label: "Send to sponsor", tone: "primary" },
    { action: "void", label: "Cancel invoice", tone: "danger" },
  ],
  sent: [
    { action: "write-off", label: "Write off", tone: "quiet" },
    { action: "void", label: "Cancel invoice", tone: "danger" },
  ],
  uncollectible: [{ action: "void", label: "Cancel invoice", tone: "danger" }],
  paid: [],
  void: [],
};

/** A payment the provider reported moves the deal's payment item too: the deal's own data is fetched again. */
function useItemsFollowPayments(channelId: string, invoices: InvoiceView[] | undefined) {
  const queryClient = useQueryClient();
  const paid = invoices?.filter((invoice) => invoice.status === "paid").length;
  const seen = useRef(paid);
  useEffect(() => {
    if (paid !== undefined && seen.current !== undefined && paid > seen.current) {
      void queryClient.invalidateQueries({ queryKey: [...sponsorKeys.deals(channelId), "episode"] });
    }
    seen.current = paid;
  }, [paid, channelId, queryClient]);
}

/** A deal's invoices at the payments provider: only owners and producers see this part. */
export function InvoicesPanel({ channelId, dealId }: { channelId: string; dealId: string }) {
  const invoices = useInvoices(channelId, dealId);
  useItemsFollowPayments(channelId, invoices.data);
  const [adding, setAdding] = useState(false);
  return (
    <div className="flex flex-col gap-3" data-testid="invoices">
      <QueryState query={invoices} loading="Loading invoices…">
        {(list) =>
          list.length === 0 ? (
            <p className="text-sm text-graphite-500">No invoice yet. Invoice the whole fee, or a part of it (an instalment), when the deal says so.</p>
          ) : (
            <ul className="flex flex-col gap-2">
              {list.map((invoice) => (
                <InvoiceRow key={invoice.id} channelId={channelId} dealId={dealId} invoice={invoice} />
              ))}
            </ul>
          )
        }
      </QueryState>
      {adding ? (
        <NewInvoiceForm channelId={channelId} dealId={dealId} onDone={() => setAdding(false)} />
      ) : (
        <div>
          <Button tone="quiet" className="px-3 py-1" onClick={() => setAdding(true)}>
            New invoice
          </Button>
        </div>
      )}
    </div>
  );
}

function InvoiceRow({ channelId, dealId, invoice }: { channelId: string; dealId: string; invoice: InvoiceView }) {
  const act = useInvoiceAction(channelId, dealId);
  const [problem, setProblem] = useState<string | null>(null);
  const run = async (action: InvoiceAction) => {
    setProblem(null);
    try {
      await act.mutateAsync({ invoiceId: invoice.id, action });
    } catch (error) {
      setProblem(error instanceof ApiError ? error.message : "Something went wrong. Try again.");
    }
  };
  return (
    <li aria-label={`Invoice ${invoice.position}: ${invoice.label}`} className="flex flex-col gap-2 rounded-md border border-ply-200 p-3 text-sm">
      <div className="flex flex-wrap items-baseline gap-x-3 gap-y-1">
        <strong>{invoice.label}</strong>
        <span>{formatMinorMoney(invoice.amountMinor, invoice.currency)}</span>
        <span className={`rounded px-2 py-0.5 text-xs font-semibold ${stageTone[invoice.stage]}`} data-testid="invoice-stage">
          {invoiceStageLabels[invoice.stage]}
        </span>
        {invoice.overdue && <span className="rounded bg-alarm-600 px-2 py-0.5 text-xs font-semibold text-white">Overdue</span>}
      </div>
      <p className="text-graphite-700">
        {invoice.number ? `No. ${invoice.number}` : "Numbered when finalised"}
        {invoice.dueDate ? ` · due by ${formatDay(invoice.dueDate)}` : ` · due ${invoice.daysUntilDue} days after it is finalised`}
        {invoice.paidAt ? ` · paid ${formatDay(invoice.paidAt.slice(0, 10))}` : ""}
      </p>
      {invoice.hostedUrl && invoice.status !== "void" && (
        <p>
          <a href={invoice.hostedUrl} target="_blank" rel="noreferrer" className="font-semibold text-rust-700 underline">
            Sponsor's payment page
          </a>{" "}
          <span className="text-graphite-500">(also in the mail the sponsor gets)</span>
        </p>
      )}
      {problem && <Notice kind="error">{problem}</Notice>}
      {stepsOf[invoice.stage].length > 0 && (
        <div className="flex flex-wrap gap-2">
          {stepsOf[invoice.stage].map((step) => (
            <Button key={step.action} tone={step.tone} className="px-3 py-1" busy={act.isPending && act.variables?.action === step.action} disabled={act.isPending} onClick={() => run(step.action)}>
              {step.label}
            </Button>
          ))}
        </div>
      )}
    </li>
  );
}

interface InvoiceForm {
  label: string;
  amount: string;
}

function NewInvoiceForm({ channelId, dealId, onDone }: { channelId: string; dealId: string; onDone: () => void }) {
  const create = useCreateInvoice(channelId, dealId);
  const [formError, setFormError] = useState<string | null>(null);
  const form = useForm<InvoiceForm, unknown, NewInvoiceInput>({
    resolver: schemaResolver(newInvoiceSchema, (v: InvoiceForm) => ({ label: v.label, amount: v.amount })),
    defaultValues: { label: "Sponsored segment", amount: "" },
  });
  const errors = form.formState.errors;
  const onSubmit = form.handleSubmit(async (body) => {
    setFormError(null);
    try {
      await create.mutateAsync(body);
      onDone();
    } catch (error) {
      setFormError(applyServerErrors(error, form.setError, ["label", "amount"]));
    }
  });
  return (
    <form onSubmit={onSubmit} noValidate aria-label="New invoice" className="grid gap-3 sm:grid-cols-3">
      {formError && (
        <div className="sm:col-span-3">
          <Notice kind="error">{formError}</Notice>
        </div>
      )}
      <TextField label="What it is for" {...form.register("label")} error={errors.label?.message} />
      <TextField label="Amount" hint="Blank: all of the fee not yet invoiced." inputMode="decimal" {...form.register("amount")} error={errors.amount?.message} />
      <FormActions className="flex items-end gap-2" submit="Create draft" busy={create.isPending} onCancel={onDone} />
    </form>
  );
}
