import { useState } from "react";
import { useForm, useWatch } from "react-hook-form";
import { Link } from "react-router-dom";
import { describeDating } from "@shared/sponsors/deliverables";
import { createDealSchema, dealStateLabels, dealStates, paymentTermsFrom, paymentTermsLabels, placementLabels, placements, type DealTemplate, type SponsorSummary } from "@shared/sponsors/schemas";
import { Notice } from "../../../components/Notice";
import { allOf, QueryState } from "../../../components/States";
import { useCreateDeal } from "../api/create-deal";
import { useSponsors } from "../api/list-sponsors";
import { useTemplates } from "../api/list-templates";
import { FormActions, SelectField, TextAreaField, TextField } from "../../../components/form-fields";
import { applyServerErrors, errorAt, linesOf, numberFrom } from "../../../lib/forms";
import { schemaResolver } from "../../../lib/schema-resolver";

interface DealForm {
  sponsorId: string;
  contactId: string;
  templateId: string;
  state: string;
  placement: string;
  segmentSeconds: string;
  talkingPoints: string;
  link: string;
  promoCode: string;
  disclosureText: string;
  exclusivityNotes: string;
  fee: string;
  currency: string;
  paymentTermsDays: string;
  paymentTermsFrom: string;
}

const moneyField: Record<string, string> = { "money.fee": "fee", "money.currency": "currency", "money.paymentTermsDays": "paymentTermsDays", "money.paymentTermsFrom": "paymentTermsFrom" };
const fieldFor = (path: string) => moneyField[path] ?? (path.startsWith("talkingPoints") ? "talkingPoints" : path);
const fieldNames = ["sponsorId", "contactId", "templateId", "state", "placement", "segmentSeconds", "talkingPoints", "link", "promoCode", "disclosureText", "exclusivityNotes", "fee", "currency", "paymentTermsDays", "paymentTermsFrom"];

const toBody = (episodeId: string | null) => (v: DealForm) => ({
  episodeId,
  sponsorId: v.sponsorId,
  contactId: v.contactId || null,
  templateId: v.templateId || null,
  state: v.state,
  placement: v.placement,
  segmentSeconds: numberFrom(v.segmentSeconds),
  talkingPoints: linesOf(v.talkingPoints),
  link: v.link,
  promoCode: v.promoCode,
  disclosureText: v.disclosureText,
  exclusivityNotes: v.exclusivityNotes,
  descriptionCopy: null,
  script: "",
  hostId: null,
  goLiveDate: null,
  money: { fee: v.fee, currency: v.currency, paymentTermsDays: numberFrom(v.paymentTermsDays), paymentTermsFrom: v.paymentTermsFrom, invoiceNumber: null, invoicedOn: null, paidOn: null },
});

interface NewDealProps {
  channelId: string;
  /** Null: a signed deal recorded against its sponsor, tied to its episode later. */
  episodeId: string | null;
  /** The sponsor the form starts with (from the sponsor's page). */
  sponsorId?: string;
  onDone: () => void;
}

/** A new deal, on an episode or waiting for one: the segment it buys, the money, and the template its items come from. */
export function NewDealForm({ channelId, episodeId, sponsorId, onDone }: NewDealProps) {
  const choices = allOf(useSponsors(channelId), useTemplates(channelId));
  return (
    <QueryState
      query={choices}
      loading="Loading the sponsors and templates…"
      isEmpty={([sponsors]) => sponsors.length === 0}
      empty={
        <Notice>
          No sponsors yet.{" "}
          <Link className="font-semibold underline" to={`/c/${channelId}/sponsors`}>
            Add the sponsor
          </Link>{" "}
          first, then make the deal here.
        </Notice>
      }
    >
      {([sponsors, templates]) => <DealFormFields channelId={channelId} episodeId={episodeId} sponsorId={sponsorId} sponsors={sponsors} templates={templates} onDone={onDone} />}
    </QueryState>
  );
}

function DealFormFields({ channelId, episodeId, sponsorId: startingSponsor, sponsors, templates, onDone }: NewDealProps & { sponsors: SponsorSummary[]; templates: DealTemplate[] }) {
  const create = useCreateDeal(channelId);
  const [formError, setFormError] = useState<string | null>(null);
  const form = useForm<DealForm, unknown, ReturnType<typeof createDealSchema.parse>>({
    resolver: schemaResolver(createDealSchema, toBody(episodeId), fieldFor),
    defaultValues: {
      sponsorId: startingSponsor ?? "",
      contactId: "",
      templateId: "",
      state: "signed",
      placement: "middle",
      segmentSeconds: "60",
      talkingPoints: "",
      link: "",
      promoCode: "",
      disclosureText: "",
      exclusivityNotes: "",
      fee: "",
      currency: "EUR",
      paymentTermsDays: "30",
      paymentTermsFrom: "invoice",
    },
  });
  const sponsorId = useWatch({ control: form.control, name: "sponsorId" });
  const templateId = useWatch({ control: form.control, name: "templateId" });
  const chosen = sponsors.find((s) => s.id === sponsorId);
  const template = templates.find((t) => t.id === templateId);
  const errors = form.formState.errors;

  const onSubmit = form.handleSubmit(async (body) => {
    setFormError(null);
    try {
      await create.mutateAsync(body);
      onDone();
    } catch (error) {
      setFormError(applyServerErrors(error, form.setError, fieldNames, fieldFor));
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate aria-label="New deal" className="flex flex-col gap-4 rounded-lg border border-ply-300 bg-white p-5">
      {formError && <Notice kind="error">{formError}</Notice>}
      {episodeId === null && <p className="text-sm text-graphite-700">Recorded against the sponsor: its items wait for a publish date until you tie it to its episode.</p>}
      <div className="grid gap-4 sm:grid-cols-3">
        <SelectField
          label="Sponsor"
          options={[{ value: "", label: "Pick a sponsor…" }, ...sponsors.map((s) => ({ value: s.id, label: s.company }))]}
          {...form.register("sponsorId")}
          error={errors.sponsorId?.message}
        />
        <SelectField
          label="Contact"
          options={[{ value: "", label: chosen?.contacts.length ? "No contact yet" : "The sponsor has no contacts" }, ...(chosen?.contacts ?? []).map((c) => ({ value: c.id, label: `${c.name} (${c.email})` }))]}
          {...form.register("contactId")}
          error={errors.contactId?.message}
        />
        <SelectField
          label="Deliverables from template"
          options={[{ value: "", label: "No template: add items by hand" }, ...templates.map((t) => ({ value: t.id, label: t.name }))]}
          {...form.register("templateId")}
          error={errors.templateId?.message}
        />
      </div>
      {template && (
        <p className="text-xs text-graphite-500">
          {template.items.length} items: {template.items.map((i) => `${i.title} (${describeDating(i.anchor, i.offsetDays)})`).join(" · ")}
        </p>
      )}
      <div className="grid gap-4 sm:grid-cols-3">
        <SelectField label="State" options={dealStates.map((s) => ({ value: s, label: dealStateLabels[s] }))} {...form.register("state")} error={errors.state?.message} />
        <SelectField label="Placement" options={placements.map((p) => ({ value: p, label: placementLabels[p] }))} {...form.register("placement")} error={errors.placement?.message} />
        <TextField label="Contracted length (seconds)" inputMode="numeric" {...form.register("segmentSeconds")} error={errors.segmentSeconds?.message} />
      </div>
      <TextAreaField label="Required talking points" rows={3} hint="One per line." {...form.register("talkingPoints")} error={errorAt(errors, "talkingPoints")} />
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField label="Link" placeholder="https://" {...form.register("link")} error={errors.link?.message} />
        <TextField label="Promo code" {...form.register("promoCode")} error={errors.promoCode?.message} />
        <TextField label="Disclosure wording" hint='Said in the segment and printed in the description, e.g. "This video is sponsored by …"' {...form.register("disclosureText")} error={errors.disclosureText?.message} />
        <TextField label="Exclusivity notes" {...form.register("exclusivityNotes")} error={errors.exclusivityNotes?.message} />
      </div>
      <fieldset className="grid gap-4 rounded-md border border-ply-200 p-3 sm:grid-cols-4">
        <legend className="px-1 text-sm font-semibold text-graphite-700">Money (owner and producer only)</legend>
        <TextField label="Fee" inputMode="decimal" {...form.register("fee")} error={errors.fee?.message} />
        <TextField label="Currency" maxLength={3} {...form.register("currency")} error={errors.currency?.message} />
        <TextField label="Payment terms (days)" inputMode="numeric" {...form.register("paymentTermsDays")} error={errors.paymentTermsDays?.message} />
        <SelectField label="Counted from" options={paymentTermsFrom.map((p) => ({ value: p, label: paymentTermsLabels[p] }))} {...form.register("paymentTermsFrom")} error={errors.paymentTermsFrom?.message} />
      </fieldset>
      <FormActions submit="Create deal" busy={create.isPending} onCancel={onDone} />
    </form>
  );
}
