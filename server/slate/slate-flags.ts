import { formatDay } from "../../shared/fields/written-dates";
import { slateFlagCodes, type BoardFlag } from "../../shared/slate/flags";
import type { GateProblem } from "../../shared/slate/gates";
import { currentStageDue, episodeRisks, publishDateOf, type DueOverrides, type RiskReason, type StageLengths } from "../../shared/slate/schedule";
import { stageLabels, type Stage } from "../../shared/slate/stages";

const day = (date: string) => formatDay(date, { withYear: false });

export function riskFlag(risk: RiskReason, current: Stage): BoardFlag {
  if (risk.code === "stage_overdue") {
    return { code: slateFlagCodes.overdue, tone: "alarm", label: "At risk: overdue", detail: `${stageLabels[risk.stage]} was due ${day(risk.date)}.` };
  }
  const detail =
    risk.stage === current
      ? `${stageLabels[risk.stage]} was due ${day(risk.date)}, before it began: the publish date leaves too few working days.`
      : `The plan needs ${stageLabels[risk.stage]} to start ${day(risk.date)}, which has passed.`;
  return { code: slateFlagCodes.planInPast, tone: "alarm", label: "At risk: plan starts in the past", detail };
}

/** The slate's own flags on one episode, and its current stage's due date. */
export function slateFlags(
  episode: { stage: Stage; targetPublishDate: string | null; dueOverrides?: DueOverrides },
  lengths: StageLengths,
  context: { enteredOn: string; today: string; skipped: { problems: GateProblem[]; reason: string | null } | null },
): { flags: BoardFlag[]; stageDue: string | null; risks: RiskReason[] } {
  const flags: BoardFlag[] = [];
  const publish = publishDateOf(episode);
  const risks = episodeRisks(episode, lengths, context.enteredOn, context.today);
  flags.push(...risks.map((risk) => riskFlag(risk, episode.stage)));
  if (context.skipped) {
    const missing = context.skipped.problems.map((p) => p.message).join(" ");
    flags.push({
      code: slateFlagCodes.essentialsSkipped,
      tone: "warn",
      label: "Moved on without essentials",
      detail: `${missing}${context.skipped.reason ? ` Reason given: ${context.skipped.reason}` : ""}`,
    });
  }
  if (publish === null && episode.stage !== "challenge") {
    flags.push({ code: slateFlagCodes.noDate, tone: "info", label: "No publish date", detail: "Set a target publish date to get due dates." });
  }
  const stageDue = publish === null ? null : currentStageDue(publish, lengths, episode.stage, episode.dueOverrides?.[episode.stage]);
  return { flags, stageDue, risks };
}
