import { useState } from "react";
import { useForm } from "react-hook-form";
import { Link, useSearchParams } from "react-router-dom";
import { roleMay } from "@shared/access/roles";
import { contactInputSchema, dealStateLabels, placementLabels, sponsorInputSchema, type SponsorDetail } from "@shared/sponsors/schemas";
import { Button } from "../../../components/Button";
import { Notice } from "../../../components/Notice";
import { PageHeader } from "../../../components/PageHeader";
import { Empty, QueryState } from "../../../components/States";
import { useOpenedRecord } from "../../../lib/conflicts";
import { formatDay, formatMoney } from "../../../lib/format";
import { useChannel } from "../../../lib/session";
import { useSponsor } from "../api/get-sponsor";
import { useSponsors } from "../api/list-sponsors";
import { useAddContact } from "../api/add-contact";
import { useCreateSponsor } from "../api/create-sponsor";
import { useRemoveContact } from "../api/remove-contact";
import { useUpdateSponsor } from "../api/update-sponsor";
import { SettingsSection } from "./SettingsSection";
import { TemplatesSection } from "./TemplatesSection";
import { WaitingDeals } from "./WaitingDeals";
import { FormActions, TextAreaField, TextField } from "../../../components/form-fields";
import { applyServerErrors } from "../../../lib/forms";
import { schemaResolver } from "../../../lib/schema-resolver";

export function SponsorsPage() {
  const channel = useChannel();
  const canEdit = roleMay(channel.role, "sponsors", "W");
  return (
    <div className="mx-auto max-w-6xl">
      <PageHeader title="Sponsors" subtitle="Companies, their contacts and every deal made with them." />
      <Directory channelId={channel.channelId} canEdit={canEdit} />
      <TemplatesSection channelId={channel.channelId} canEdit={roleMay(channel.role, "deliverables", "W")} />
      <SettingsSection channelId={channel.channelId} canEditReminders={roleMay(channel.role, "deliverables", "W")} canEditRates={canEdit} />
    </div>
  );
}

function Directory({ channelId, canEdit }: { channelId: string; canEdit: boolean }) {
  const sponsors = useSponsors(channelId);
  const [params, setParams] = useSearchParams();
  const selected = params.get("sponsor") ?? sponsors.data?.[0]?.id ?? null;
  const select = (id: string) => setParams({ sponsor: id }, { replace: true });

  return (
    <div className="grid grid-cols-1 gap-6 lg:grid-cols-[18rem_1fr]">
      <div className="flex min-w-0 flex-col gap-4">
        <QueryState
          query={sponsors}
          loading="Loading sponsors…"
          isEmpty={(list) => list.length === 0}
          empty={<Empty title="No sponsors yet">{canEdit ? "Add the first one below." : "A producer adds them."}</Empty>}
        >
          {(list) => (
            <ul aria-label="Sponsors" className="flex flex-col gap-1">
              {list.map((s) => (
                <li key={s.id}>
                  <button
                    type="button"
                    onClick={() => select(s.id)}
                    aria-current={s.id === selected ? "true" : undefined}
                    className={`w-full rounded-md border px-3 py-2 text-left ${s.id === selected ? "border-rust-600 bg-white" : "border-ply-300 bg-ply-50 hover:bg-white"}`}
                  >
                    <span className="block font-medium">{s.company}</span>
                    <span className="text-xs text-graphite-500">
                      {s.contacts.length} {s.contacts.length === 1 ? "contact" : "contacts"} · {s.dealCount} {s.dealCount === 1 ? "deal" : "deals"}
                    </span>
                  </button>
                </li>
              ))}
            </ul>
          )}
        </QueryState>
        {canEdit && <NewSponsorForm channelId={channelId} onMade={select} />}
      </div>
      <div className="min-w-0">{selected ? <SponsorPanel channelId={channelId} sponsorId={selected} canEdit={canEdit} /> : null}</div>
    </div>
  );
}

interface SponsorValues {
  company: string;
  website: string;
  notes: string;
}

function NewSponsorForm({ channelId, onMade }: { channelId: string; onMade: (id: string) => void }) {
  const create = useCreateSponsor(channelId);
  const [formError, setFormError] = useState<string | null>(null);
  const form = useForm<SponsorValues, unknown, ReturnType<typeof sponsorInputSchema.parse>>({
    resolver: schemaResolver(sponsorInputSchema, (v: SponsorValues) => v),
    defaultValues: { company: "", website: "", notes: "" },
  });
  const onSubmit = form.handleSubmit(async (body) => {
    setFormError(null);
    try {
      const sponsor = await create.mutateAsync(body);
      form.reset();
      onMade(sponsor.id);
    } catch (error) {
      setFormError(applyServerErrors(error, form.setError, ["company", "website", "notes"]));
    }
  });
  return (
    <form onSubmit={onSubmit} noValidate aria-label="Add a sponsor" className="flex flex-col gap-3 rounded-lg border border-ply-300 bg-white p-4">
      <h2 className="font-semibold">Add a sponsor</h2>
      {formError && <Notice kind="error">{formError}</Notice>}
      <TextField label="Company" {...form.register("company")} error={form.formState.errors.company?.message} />
      <TextField label="Website" placeholder="https://" {...form.register("website")} error={form.formState.errors.website?.message} />
      <Button type="submit" busy={create.isPending}>
        Add sponsor
      </Button>
    </form>
  );
}

function SponsorPanel({ channelId, sponsorId, canEdit }: { channelId: string; sponsorId: string; canEdit: boolean }) {
  const sponsor = useSponsor(channelId, sponsorId);
  return (
    <QueryState query={sponsor} loading="Loading the sponsor…" back={{ to: `/c/${channelId}/sponsors`, label: "Sponsors" }}>
      {(detail) => <SponsorDetailView key={detail.id} channelId={channelId} sponsor={detail} canEdit={canEdit} />}
    </QueryState>
  );
}

function SponsorDetailView({ channelId, sponsor, canEdit }: { channelId: string; sponsor: SponsorDetail; canEdit: boolean }) {
  const [editing, setEditing] = useState(false);
  const tied = sponsor.deals.filter((d) => d.episodeId !== null);
  return (
    <article aria-label={sponsor.company} className="flex min-w-0 flex-col gap-5 rounded-lg border border-ply-300 bg-white p-4 sm:p-5">
      {editing ? (
        <EditSponsorForm channelId={channelId} sponsor={sponsor} onDone={() => setEditing(false)} />
      ) : (
        <header className="flex flex-wrap items-start justify-between gap-3">
          <div>
            <h2 className="text-xl font-semibold">{sponsor.company}</h2>
            {sponsor.website && (
              <a href={sponsor.website} className="text-sm text-rust-600 underline" rel="noreferrer noopener" target="_blank">
                {sponsor.website}
              </a>
            )}
            {sponsor.notes && <p className="mt-2 whitespace-pre-wrap text-sm text-graphite-700">{sponsor.notes}</p>}
          </div>
          {canEdit && (
            <Button tone="quiet" onClick={() => setEditing(true)}>
              Edit
            </Button>
          )}
        </header>
      )}
      <Contacts channelId={channelId} sponsor={sponsor} canEdit={canEdit} />
      <WaitingDeals channelId={channelId} sponsor={sponsor} canEdit={canEdit} />
      <section aria-labelledby="deal-history">
        <h3 id="deal-history" className="mb-2 font-semibold">
          Deals on episodes
        </h3>
        {tied.length === 0 ? (
          <p className="text-sm text-graphite-500">No deals on an episode yet. Make one from the episode's page, or record a signed deal above.</p>
        ) : (
          <div className="overflow-x-auto">
            <table className="w-full text-left text-sm">
              <thead className="text-xs uppercase tracking-wide text-graphite-500">
                <tr>
                  <th className="py-1">Episode</th>
                  <th className="py-1">State</th>
                  <th className="py-1">Placement</th>
                  <th className="py-1">Publish</th>
                  {tied.some((d) => d.money) && <th className="py-1 text-right">Fee</th>}
                </tr>
              </thead>
              <tbody className="divide-y divide-ply-200">
                {tied.map((deal) => (
                  <tr key={deal.id}>
                    <td className="py-2">
                      <Link className="underline" to={`/c/${channelId}/episodes/${deal.episodeId}/sponsor-deals`}>
                        {deal.episodeTitle}
                      </Link>
                    </td>
                    <td className="py-2">{dealStateLabels[deal.state]}</td>
                    <td className="py-2">{placementLabels[deal.placement]}</td>
                    <td className="py-2">{formatDay(deal.publishDate) || "Waiting for a publish date"}</td>
                    {deal.money && <td className="py-2 text-right">{formatMoney(deal.money.fee, deal.money.currency)}</td>}
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        )}
      </section>
    </article>
  );
}

const sponsorValues = (sponsor: SponsorDetail): SponsorValues => ({ company: sponsor.company, website: sponsor.website ?? "", notes: sponsor.notes ?? "" });

function EditSponsorForm({ channelId, sponsor, onDone }: { channelId: string; sponsor: SponsorDetail; onDone: () => void }) {
  const update = useUpdateSponsor(channelId, sponsor.id);
  const [formError, setFormError] = useState<string | null>(null);
  const form = useForm<SponsorValues, unknown, ReturnType<typeof sponsorInputSchema.parse>>({
    resolver: schemaResolver(sponsorInputSchema, (v: SponsorValues) => v),
    defaultValues: sponsorValues(sponsor),
  });
  const record = useOpenedRecord(sponsor, (current) => form.reset(sponsorValues(current)));
  const onSubmit = form.handleSubmit(async (body) => {
    setFormError(null);
    try {
      await update.mutateAsync({ ...body, version: record.version });
      onDone();
    } catch (error) {
      setFormError(record.conflictIn(error) ?? applyServerErrors(error, form.setError, ["company", "website", "notes"]));
    }
  });
  return (
    <form onSubmit={onSubmit} noValidate aria-label="Edit sponsor" className="flex flex-col gap-3">
      {formError && <Notice kind="error">{formError}</Notice>}
      <div className="grid grid-cols-1 gap-3 sm:grid-cols-2">
        <TextField label="Company" {...form.register("company")} error={form.formState.errors.company?.message} />
        <TextField label="Website" {...form.register("website")} error={form.formState.errors.website?.message} />
      </div>
      <TextAreaField label="Notes" rows={3} {...form.register("notes")} error={form.formState.errors.notes?.message} />
      <FormActions submit="Save" busy={update.isPending} onCancel={onDone} />
    </form>
  );
}

interface ContactValues {
  name: string;
  email: string;
  role: string;
}

function Contacts({ channelId, sponsor, canEdit }: { channelId: string; sponsor: SponsorDetail; canEdit: boolean }) {
  const add = useAddContact(channelId, sponsor.id);
  const remove = useRemoveContact(channelId, sponsor.id);
  const [formError, setFormError] = useState<string | null>(null);
  const form = useForm<ContactValues, unknown, ReturnType<typeof contactInputSchema.parse>>({
    resolver: schemaResolver(contactInputSchema, (v: ContactValues) => v),
    defaultValues: { name: "", email: "", role: "" },
  });
  const onSubmit = form.handleSubmit(async (body) => {
    setFormError(null);
    try {
      await add.mutateAsync(body);
      form.reset();
    } catch (error) {
      setFormError(applyServerErrors(error, form.setError, ["name", "email", "role"]));
    }
  });
  return (
    <section aria-labelledby="contacts-heading">
      <h3 id="contacts-heading" className="mb-2 font-semibold">
        Contacts
      </h3>
      {sponsor.contacts.length === 0 ? (
        <p className="mb-3 text-sm text-graphite-500">No contacts yet. Review links go to a contact's e-mail.</p>
      ) : (
        <ul className="mb-3 divide-y divide-ply-200 rounded-md border border-ply-200 text-sm">
          {sponsor.contacts.map((c) => (
            <li key={c.id} className="flex items-center gap-3 px-3 py-2">
              <span className="flex-1">
                <span className="font-medium">{c.name}</span> · {c.email}
                {c.role && <span className="text-graphite-500"> · {c.role}</span>}
              </span>
              {canEdit && (
                <Button tone="danger" className="px-2 py-1" onClick={() => remove.mutate(c.id)} aria-label={`Remove ${c.name}`}>
                  Remove
                </Button>
              )}
            </li>
          ))}
        </ul>
      )}
      {canEdit && (
        <form onSubmit={onSubmit} noValidate aria-label="Add a contact" className="grid grid-cols-1 items-start gap-3 sm:grid-cols-[1fr_1fr_1fr_auto]">
          {formError && (
            <div className="sm:col-span-4">
              <Notice kind="error">{formError}</Notice>
            </div>
          )}
          <TextField label="Contact name" {...form.register("name")} error={form.formState.errors.name?.message} />
          <TextField label="Contact e-mail" type="email" {...form.register("email")} error={form.formState.errors.email?.message} />
          <TextField label="Their role" {...form.register("role")} error={form.formState.errors.role?.message} />
          <Button type="submit" tone="quiet" className="sm:mt-6" busy={add.isPending}>
            Add contact
          </Button>
        </form>
      )}
    </section>
  );
}
