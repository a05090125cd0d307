/**
 * A short marker on a board card ("At risk", "Sponsor item due"). The slate raises its own; other
 * features add theirs through server/slate/flags.ts. `code` is "<feature>.<what>".
 */
export type FlagTone = "warn" | "alarm" | "info";

export interface BoardFlag {
  code: string;
  label: string;
  tone: FlagTone;
  /** A longer explanation, shown on hover and read by screen readers. */
  detail?: string;
}

/** The slate's own flags. Both risk flags count as "at risk" for the board's filter. */
export const slateFlagCodes = {
  overdue: "slate.stage_overdue",
  planInPast: "slate.plan_in_past",
  essentialsSkipped: "slate.essentials_skipped",
  noDate: "slate.no_publish_date",
} as const;

export const atRiskCodes: readonly string[] = [slateFlagCodes.overdue, slateFlagCodes.planInPast];

export const isAtRisk = (flags: readonly BoardFlag[]) => flags.some((f) => atRiskCodes.includes(f.code));
