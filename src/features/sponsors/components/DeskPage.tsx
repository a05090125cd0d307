import { useState } from "react";
import { roleMay } from "@shared/access/roles";
import { Link, useSearchParams } from "react-router-dom";
import { deliverableKindLabels, deliverableStatusLabels, deliverableStatuses, deskGroupLabels, type DeliverableStatus, type DeskGroup } from "@shared/sponsors/deliverables";
import type { DeskItem } from "@shared/sponsors/schemas";
import { PageHeader } from "../../../components/PageHeader";
import { Empty, QueryState } from "../../../components/States";
import { DAY_MS, formatDay, formatDuration } from "../../../lib/format";
import { useChannel } from "../../../lib/session";
import { useDesk } from "../api/get-desk";
import { useUpdateDeliverable } from "../api/update-deliverable";
import { StatusTag } from "./labels";
import { OverdueInvoices } from "./OverdueInvoices";

// The order the producer reads the desk in; each item sits in exactly one group (see deskGroupOf).
const shownOrder: DeskGroup[] = ["overdue", "changes_asked", "due_soon", "waiting", "later"];
const groupAccent: Record<DeskGroup, string> = {
  overdue: "border-alarm-600 text-alarm-600",
  changes_asked: "border-rust-600 text-rust-600",
  due_soon: "border-amber-cut text-graphite-900",
  waiting: "border-graphite-500 text-graphite-700",
  later: "border-ply-300 text-graphite-700",
};

/** The producer's desk: every open deliverable across episodes, by what needs doing first. */
export function DeskPage() {
  const channel = useChannel();
  return (
    <>
      <Desk channelId={channel.channelId} />
      {roleMay(channel.role, "fees", "R") && (
        <div className="mx-auto max-w-5xl">
          <OverdueInvoices channelId={channel.channelId} />
        </div>
      )}
    </>
  );
}

function Desk({ channelId }: { channelId: string }) {
  const [params, setParams] = useSearchParams();
  const filter = { sponsorId: params.get("sponsor") ?? undefined, episodeId: params.get("episode") ?? undefined };
  const desk = useDesk(channelId, filter);
  // Said once a status change is saved: the row may move to another group or leave the desk.
  const [announcement, setAnnouncement] = useState("");
  const setFilter = (key: "sponsor" | "episode", value: string) => {
    const next = new URLSearchParams(params);
    if (value) next.set(key, value);
    else next.delete(key);
    setParams(next, { replace: true });
  };

  return (
    <div className="mx-auto max-w-5xl">
      <PageHeader title="Desk" subtitle={desk.data ? `Every open sponsor item, as of ${formatDay(desk.data.today)}.` : "Every open sponsor item."} />
      <QueryState query={desk} loading="Loading the desk…" page>
        {(data) => (
          <>
            <ul aria-label="Counts" className="mb-6 grid grid-cols-2 gap-3 sm:grid-cols-5">
              {shownOrder.map((group) => (
                <li key={group} className={`rounded-lg border-l-4 bg-white p-3 shadow-sm ${groupAccent[group]}`}>
                  <a href={`#desk-${group}`} className="block">
                    <span className="block text-2xl font-bold" data-testid={`count-${group}`}>
                      {data.counts[group]}
                    </span>
                    <span className="text-sm">{deskGroupLabels[group]}</span>
                  </a>
                </li>
              ))}
            </ul>
            <div className="mb-6 flex flex-wrap gap-4">
              <FilterSelect label="Sponsor" value={filter.sponsorId ?? ""} onChange={(v) => setFilter("sponsor", v)} options={data.sponsors.map((s) => ({ value: s.id, label: s.company }))} />
              <FilterSelect label="Episode" value={filter.episodeId ?? ""} onChange={(v) => setFilter("episode", v)} options={data.episodes.map((e) => ({ value: e.id, label: e.title }))} />
            </div>
            {data.items.length === 0 ? (
              <Empty title="Nothing open">{filter.sponsorId || filter.episodeId ? "No open items for this filter." : "Deals' deliverables appear here once a deal has items."}</Empty>
            ) : (
              shownOrder.map((group) => <Group key={group} channelId={channelId} group={group} items={data.items.filter((i) => i.group === group)} onSaved={setAnnouncement} />)
            )}
            <p role="status" className="sr-only" data-testid="desk-announcement">
              {announcement}
            </p>
          </>
        )}
      </QueryState>
    </div>
  );
}

function FilterSelect({ label, value, onChange, options }: { label: string; value: string; onChange: (value: string) => void; options: { value: string; label: string }[] }) {
  const id = `desk-filter-${label.toLowerCase()}`;
  return (
    <div className="flex min-w-0 max-w-full items-center gap-2 text-sm">
      <label htmlFor={id} className="font-medium text-graphite-700">
        {label}
      </label>
      <select id={id} value={value} onChange={(e) => onChange(e.target.value)} className="min-w-0 max-w-full rounded-md border border-ply-300 bg-white px-2 py-1">
        <option value="">All</option>
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
    </div>
  );
}

function Group({ channelId, group, items, onSaved }: { channelId: string; group: DeskGroup; items: DeskItem[]; onSaved: (announcement: string) => void }) {
  if (items.length === 0) return null;
  return (
    <section id={`desk-${group}`} aria-labelledby={`desk-${group}-heading`} className="mb-6">
      <h2 id={`desk-${group}-heading`} className="mb-2 font-semibold">
        {deskGroupLabels[group]} <span className="text-graphite-500">({items.length})</span>
      </h2>
      <ul className="divide-y divide-ply-200 rounded-lg border border-ply-300 bg-white">
        {items.map((item) => (
          <li key={item.id} className="grid grid-cols-1 gap-2 px-4 py-3 sm:grid-cols-[7rem_1fr_12rem_9rem] sm:items-center">
            <span className={`text-sm font-semibold ${group === "overdue" ? "text-alarm-600" : ""}`}>
              {formatDay(item.dueDate) || "No date"}
              {item.daysLate > 0 && <span className="block text-xs font-normal">late by {formatDuration(item.daysLate * DAY_MS, { smallest: "d" })}</span>}
            </span>
            <span>
              <Link to={`/c/${channelId}/episodes/${item.episodeId}/sponsor-deals`} className="font-medium text-graphite-900 underline decoration-ply-300 hover:decoration-rust-600">
                {item.title}
              </Link>
              <span className="block text-xs text-graphite-500">
                {item.company} · {item.episodeTitle} · {deliverableKindLabels[item.kind]}
              </span>
            </span>
            <span className="text-sm text-graphite-700">{item.ownerName ?? "No owner"}</span>
            {item.canEdit ? <StatusControl channelId={channelId} item={item} onSaved={onSaved} /> : <StatusTag status={item.status} />}
          </li>
        ))}
      </ul>
    </section>
  );
}

/**
 * The item's status, changed in place. The new status shows at once and stays while the desk is
 * fetched again (the mutation is pending until then); a refusal puts the old one back and says why.
 */
function StatusControl({ channelId, item, onSaved }: { channelId: string; item: DeskItem; onSaved: (announcement: string) => void }) {
  const update = useUpdateDeliverable(channelId);
  const shown = update.isPending ? (update.variables.input.status ?? item.status) : item.status;
  const id = `desk-status-${item.id}`;
  // Said through the promise, not mutate's own onSuccess: the saved row may move to another group
  // (this control unmounts) before that callback would run, and it would then never run.
  const change = (status: DeliverableStatus) =>
    update.mutateAsync({ id: item.id, input: { status, version: item.version } }).then(
      () => onSaved(`"${item.title}" is now ${deliverableStatusLabels[status].toLowerCase()}.`),
      () => undefined,
    );
  return (
    <div className="flex flex-col gap-1">
      <label className="sr-only" htmlFor={id}>
        Status of {item.title}
      </label>
      <select
        id={id}
        value={shown}
        aria-busy={update.isPending}
        aria-invalid={update.isError}
        aria-describedby={update.isError ? `${id}-error` : undefined}
        onChange={(e) => change(e.target.value as DeliverableStatus)}
        className="rounded-md border border-ply-300 bg-white px-2 py-1 text-sm aria-busy:opacity-70"
      >
        {deliverableStatuses.map((s) => (
          <option key={s} value={s}>
            {deliverableStatusLabels[s]}
          </option>
        ))}
      </select>
      {update.isPending && <span className="text-xs text-graphite-500">Saving…</span>}
      {update.isError && (
        <span id={`${id}-error`} role="alert" className="text-xs text-alarm-600">
          Not saved: {update.error.message}
        </span>
      )}
    </div>
  );
}
