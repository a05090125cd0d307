import { Link } from "react-router-dom";
import { useState, type ReactNode } from "react";
import { useForm } from "react-hook-form";
import { roleMay, type Role } from "@shared/access/roles";
import { dealStateLabels, dealStates, placementLabels, placements, updateDealSchema, type DealView } from "@shared/sponsors/schemas";
import { Button } from "../../../components/Button";
import { Notice } from "../../../components/Notice";
import { changedFields, useOpenedRecord } from "../../../lib/conflicts";
import { formatDay, formatSeconds } from "../../../lib/format";
import { useUpdateDeal } from "../api/update-deal";
import { CutPanel } from "./CutPanel";
import { DeliverablesPanel } from "./DeliverablesPanel";
import { DealStateTag } from "./labels";
import { InvoicesPanel } from "./InvoicesPanel";
import { MoneyPanel } from "./MoneyPanel";
import { ReadPanel } from "./ReadPanel";
import { ReviewPanel } from "./ReviewPanel";
import { FormActions, SelectField, TextAreaField, TextField } from "../../../components/form-fields";
import { applyServerErrors, errorAt, linesOf, numberFrom } from "../../../lib/forms";
import { schemaResolver } from "../../../lib/schema-resolver";

function Part({ title, children }: { title: string; children: ReactNode }) {
  return (
    <section className="border-t border-ply-200 pt-4">
      <h4 className="mb-2 text-sm font-semibold uppercase tracking-wide text-graphite-500">{title}</h4>
      {children}
    </section>
  );
}

/** One deal on the episode page: what the segment must hold, the read, the items, review links, the cut and (for some) the money. */
export function DealCard({ channelId, deal, role }: { channelId: string; deal: DealView; role: Role }) {
  const canEditDeal = roleMay(role, "sponsors", "W");
  const canManage = roleMay(role, "deliverables", "W");
  const deliversCut = canManage || role === "editor";
  return (
    <article aria-label={`Deal with ${deal.sponsor.company}`} className="flex flex-col gap-4 rounded-lg border border-ply-300 bg-white p-5">
      <header className="flex flex-wrap items-baseline gap-3">
        <h3 className="text-lg font-semibold">{deal.sponsor.company}</h3>
        <DealStateTag state={deal.state} />
        <span className="text-sm text-graphite-500">
          {placementLabels[deal.placement]} read · {formatSeconds(deal.segmentSeconds)} contracted
          {deal.contact ? ` · contact ${deal.contact.name}` : ""}
        </span>
        {deal.episodeId && (
          <Link className="text-sm font-semibold text-rust-700 underline" to={`/c/${channelId}/deals/${deal.id}/report`}>
            The sponsor&apos;s report
          </Link>
        )}
      </header>
      {deal.money && <MoneyPanel channelId={channelId} deal={deal} value={deal.money} />}
      {deal.money && (
        <Part title="Invoices">
          <InvoicesPanel channelId={channelId} dealId={deal.id} />
        </Part>
      )}
      <Part title="Segment requirements">
        <SegmentPanel channelId={channelId} deal={deal} canEdit={canEditDeal} />
      </Part>
      <Part title="The read">
        <ReadPanel channelId={channelId} deal={deal} canEdit={canEditDeal} />
      </Part>
      <Part title="Deliverables">
        <DeliverablesPanel channelId={channelId} deal={deal} canManage={canManage} />
      </Part>
      {canManage && (
        <Part title="Sponsor review">
          <ReviewPanel channelId={channelId} deal={deal} />
        </Part>
      )}
      <Part title="The cut">
        <CutPanel channelId={channelId} deal={deal} canEdit={deliversCut} />
      </Part>
    </article>
  );
}

function SegmentPanel({ channelId, deal, canEdit }: { channelId: string; deal: DealView; canEdit: boolean }) {
  const [editing, setEditing] = useState(false);
  if (editing) return <SegmentForm channelId={channelId} deal={deal} onDone={() => setEditing(false)} />;
  return (
    <div className="flex flex-col gap-2">
      <dl className="grid gap-x-4 gap-y-1 text-sm sm:grid-cols-[11rem_1fr]">
        <dt className="text-graphite-500">Contracted length</dt>
        <dd data-testid="segment-length">
          {deal.segmentSeconds} s ({formatSeconds(deal.segmentSeconds)})
        </dd>
        <dt className="text-graphite-500">Talking points</dt>
        <dd>
          {deal.talkingPoints.length === 0 ? (
            "None required"
          ) : (
            <ul className="list-disc pl-5" data-testid="talking-points">
              {deal.talkingPoints.map((p) => (
                <li key={p}>{p}</li>
              ))}
            </ul>
          )}
        </dd>
        <dt className="text-graphite-500">Link</dt>
        <dd data-testid="segment-link">{deal.link ?? "None"}</dd>
        <dt className="text-graphite-500">Promo code</dt>
        <dd data-testid="segment-code">{deal.promoCode ?? "None"}</dd>
        <dt className="text-graphite-500">Disclosure wording</dt>
        <dd>{deal.disclosureText ?? "Not set: a plain label such as “Sponsored” or “Ad” counts"}</dd>
        <dt className="text-graphite-500">Exclusivity</dt>
        <dd>{deal.exclusivityNotes ?? "None noted"}</dd>
        <dt className="text-graphite-500">Go-live</dt>
        <dd>{deal.goLiveDate ? `${formatDay(deal.goLiveDate)} (the deal's own date)` : deal.publishDate ? `${formatDay(deal.publishDate)} (the publish date)` : "Follows the publish date (not set)"}</dd>
      </dl>
      {canEdit && (
        <div>
          <Button tone="quiet" className="px-2 py-1" onClick={() => setEditing(true)}>
            Edit requirements
          </Button>
        </div>
      )}
    </div>
  );
}

interface SegmentValues {
  state: string;
  placement: string;
  segmentSeconds: string;
  talkingPoints: string;
  link: string;
  promoCode: string;
  disclosureText: string;
  exclusivityNotes: string;
  contactId: string;
  goLiveDate: string;
}

const segmentNames = ["state", "placement", "segmentSeconds", "talkingPoints", "link", "promoCode", "disclosureText", "exclusivityNotes", "contactId", "goLiveDate"];
const segmentField = (path: string) => (path.startsWith("talkingPoints") ? "talkingPoints" : path);

const segmentBody = (v: SegmentValues) => ({ ...v, segmentSeconds: numberFrom(v.segmentSeconds), talkingPoints: linesOf(v.talkingPoints), contactId: v.contactId || null });

const segmentValues = (deal: DealView): SegmentValues => ({
  state: deal.state,
  placement: deal.placement,
  segmentSeconds: String(deal.segmentSeconds),
  talkingPoints: deal.talkingPoints.join("\n"),
  link: deal.link ?? "",
  promoCode: deal.promoCode ?? "",
  disclosureText: deal.disclosureText ?? "",
  exclusivityNotes: deal.exclusivityNotes ?? "",
  contactId: deal.contact?.id ?? "",
  goLiveDate: deal.goLiveDate ?? "",
});

/** Sends only the fields its editor changed, against the version the form opened with. */
function SegmentForm({ channelId, deal, onDone }: { channelId: string; deal: DealView; onDone: () => void }) {
  const update = useUpdateDeal(channelId, deal.id);
  const [formError, setFormError] = useState<string | null>(null);
  const form = useForm<SegmentValues, unknown, ReturnType<typeof updateDealSchema.parse>>({
    resolver: schemaResolver(updateDealSchema, segmentBody, segmentField),
    defaultValues: segmentValues(deal),
  });
  const record = useOpenedRecord(deal, (current) => form.reset(segmentValues(current)));
  const errors = form.formState.errors;
  const onSubmit = form.handleSubmit(async (body) => {
    setFormError(null);
    const changes = changedFields(updateDealSchema.parse(segmentBody(segmentValues(record.opened))), body);
    if (Object.keys(changes).length === 0) return onDone();
    try {
      await update.mutateAsync({ ...changes, version: record.version });
      onDone();
    } catch (error) {
      setFormError(record.conflictIn(error) ?? applyServerErrors(error, form.setError, segmentNames, segmentField));
    }
  });
  return (
    <form onSubmit={onSubmit} noValidate aria-label="Segment requirements" className="flex flex-col gap-3">
      {formError && <Notice kind="error">{formError}</Notice>}
      <div className="grid gap-3 sm:grid-cols-3">
        <SelectField label="State" options={dealStates.map((s) => ({ value: s, label: dealStateLabels[s] }))} {...form.register("state")} error={errors.state?.message} />
        <SelectField label="Placement" options={placements.map((p) => ({ value: p, label: placementLabels[p] }))} {...form.register("placement")} error={errors.placement?.message} />
        <TextField label="Contracted length (seconds)" inputMode="numeric" {...form.register("segmentSeconds")} error={errors.segmentSeconds?.message} />
      </div>
      <TextAreaField label="Required talking points" rows={3} hint="One per line." {...form.register("talkingPoints")} error={errorAt(errors, "talkingPoints")} />
      <div className="grid gap-3 sm:grid-cols-2">
        <TextField label="Link" {...form.register("link")} error={errors.link?.message} />
        <TextField label="Promo code" {...form.register("promoCode")} error={errors.promoCode?.message} />
        <TextField label="Disclosure wording" {...form.register("disclosureText")} error={errors.disclosureText?.message} />
        <TextField label="Exclusivity notes" {...form.register("exclusivityNotes")} error={errors.exclusivityNotes?.message} />
        <SelectField label="Contact" options={[{ value: "", label: "No contact" }, ...deal.contacts.map((c) => ({ value: c.id, label: `${c.name} (${c.email})` }))]} {...form.register("contactId")} error={errors.contactId?.message} />
        <TextField label="Go-live date" type="date" hint="Leave empty to go live on the publish date." {...form.register("goLiveDate")} error={errors.goLiveDate?.message} />
      </div>
      <FormActions submit="Save requirements" busy={update.isPending} onCancel={onDone} />
    </form>
  );
}
