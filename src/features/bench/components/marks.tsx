import type { ReactNode } from "react";
import type { CriterionOutcome, PlanVerdict } from "@shared/bench/criteria";
import { verdictLabels } from "@shared/bench/format";

/** Small marks the bench screens share: verdicts, outcomes, cautions. Words always come with the colour. */

const verdictStyles: Record<PlanVerdict, string> = {
  pass: "bg-moss-600 text-white",
  fail: "bg-alarm-600 text-white",
  incomplete: "bg-ply-200 text-graphite-700 border border-ply-300",
};

const verdictGlyphs: Record<PlanVerdict, string> = { pass: "✓", fail: "✕", incomplete: "…" };

export function VerdictBadge({ verdict }: { verdict: PlanVerdict }) {
  return (
    <span className={`inline-flex items-center gap-1 rounded px-2 py-0.5 text-xs font-semibold whitespace-nowrap ${verdictStyles[verdict]}`}>
      <span aria-hidden>{verdictGlyphs[verdict]}</span>
      <span>{verdictLabels[verdict]}</span>
    </span>
  );
}

export function OutcomeMark({ outcome }: { outcome: CriterionOutcome }) {
  if (outcome === "pass")
    return (
      <span className="font-semibold text-moss-600">
        <span aria-hidden>✓</span> pass
      </span>
    );
  if (outcome === "fail")
    return (
      <span className="font-semibold text-alarm-600">
        <span aria-hidden>✗</span> fail
      </span>
    );
  if (outcome === "not_measured") return <span className="text-graphite-500">– not measured</span>;
  return (
    <span role="alert" className="font-semibold text-alarm-600">
      ! {outcome.message}
    </span>
  );
}

/** A caution where someone could get hurt or a part could fail: stands out, and says who governs. */
export function Caution({ title, children }: { title: string; children: ReactNode }) {
  return (
    <div role="note" aria-label={title} className="rounded-md border-l-4 border-amber-cut bg-amber-cut/10 px-4 py-3 text-sm text-graphite-900">
      <p className="font-semibold">
        <span aria-hidden>⚠ </span>
        {title}
      </p>
      <div className="mt-1 text-graphite-700">{children}</div>
    </div>
  );
}

export function Panel({ children, className = "" }: { children: ReactNode; className?: string }) {
  return <div className={`rounded-lg border border-ply-300 bg-white p-5 ${className}`}>{children}</div>;
}
