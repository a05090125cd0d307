import type { ReactNode } from "react";
import { deliverableStatusLabels, type DeliverableStatus } from "@shared/sponsors/deliverables";
import { disclosureGuidance, DISCLOSURE_LAW_NOTE } from "@shared/sponsors/disclosure";
import { dealStateLabels, type DealState } from "@shared/sponsors/schemas";
import { DAY_MS, formatDuration } from "../../../lib/format";

const statusTone: Record<DeliverableStatus, "neutral" | "warn" | "good" | "alarm"> = {
  not_started: "neutral",
  sent: "warn",
  changes_asked: "alarm",
  approved: "good",
  done: "good",
};

export function StatusTag({ status, late, daysLate }: { status: DeliverableStatus; late?: boolean; daysLate?: number }) {
  return (
    <span className="inline-flex flex-wrap gap-1">
      <Tag tone={statusTone[status]}>{deliverableStatusLabels[status]}</Tag>
      {late && <Tag tone="alarm">{daysLate ? `Late by ${formatDuration(daysLate * DAY_MS, { smallest: "d" })}` : "Late"}</Tag>}
    </span>
  );
}

export function DealStateTag({ state }: { state: DealState }) {
  const tone = state === "cancelled" ? "alarm" : state === "live" || state === "wrapped" ? "good" : state === "signed" ? "warn" : "neutral";
  return <Tag tone={tone}>{dealStateLabels[state]}</Tag>;
}

/** Where the disclosure check comes from, and what it is not. */
export function DisclosureGuidance() {
  return (
    <aside aria-label="Disclosure guidance" className="rounded-md border border-ply-300 bg-ply-50 p-3 text-xs text-graphite-700">
      <p className="mb-1 font-semibold">Disclosure of paid promotion</p>
      <ul className="mb-1 list-disc pl-5">
        {disclosureGuidance.map((g) => (
          <li key={g.where}>
            <span className="font-medium">{g.where}:</span> {g.title}. {g.point}
          </li>
        ))}
      </ul>
      <p>{DISCLOSURE_LAW_NOTE}</p>
    </aside>
  );
}

type Tone = "neutral" | "warn" | "alarm" | "good";
const tones: Record<Tone, string> = {
  neutral: "bg-ply-200 text-graphite-700",
  warn: "bg-amber-cut/30 text-graphite-900",
  alarm: "bg-alarm-600/10 text-alarm-600",
  good: "bg-moss-600/10 text-moss-600",
};

export function Tag({ tone = "neutral", children }: { tone?: Tone; children: ReactNode }) {
  return <span className={`inline-flex items-center rounded px-2 py-0.5 text-xs font-semibold ${tones[tone]}`}>{children}</span>;
}
