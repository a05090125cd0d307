import { z } from "zod";
import { addWorkingDays, lastWorkingDayOnOrBefore, nextWorkingDayAfter, type IsoDate } from "./dates";
import { stageIndex, stageLabels, stages, type Stage } from "./stages";

/**
 * The schedule of an episode, counted back from its target publish date in working days
 * (Monday to Friday) with each stage's length from the channel's settings.
 *
 * - The publish stage is due on the target publish date itself, weekend or not: videos go out any day.
 * - A stage takes its length in working days, ending on its due date (a due date on a weekend counts
 *   from the Friday before). The stage before it is due on the working day before its first day.
 * - An override moves one stage's due date and nothing else; the countback of the others stays.
 * - A stage starts on the working day after the stage before it is due.
 */
export type StageLengths = Record<Stage, number>;

/** Kerf's starting lengths for a new channel, in working days: a product default, not from any source. */
export const defaultStageLengths: StageLengths = {
  challenge: 3,
  test_plan: 4,
  build: 10,
  shoot: 3,
  edit: 7,
  sponsor_read: 3,
  publish: 1,
};

export const MAX_STAGE_DAYS = 120;

export const stageLengthsSchema = z.strictObject(
  Object.fromEntries(
    stages.map((stage) => [
      stage,
      z
        .number({ error: `Give ${stageLabels[stage]} a number of working days.` })
        .int(`${stageLabels[stage]}: whole working days only.`)
        .min(1, `${stageLabels[stage]} needs at least 1 working day.`)
        .max(MAX_STAGE_DAYS, `${stageLabels[stage]}: at most ${MAX_STAGE_DAYS} working days.`),
    ]),
  ) as Record<Stage, z.ZodNumber>,
);

export type DueOverrides = Partial<Record<Stage, IsoDate>>;

export interface ScheduledStage {
  stage: Stage;
  lengthDays: number;
  /** First working day of the stage. */
  start: IsoDate;
  /** The due date in force: the override when there is one, else the counted one. */
  due: IsoDate;
  /** The due date the countback gives. */
  countedDue: IsoDate;
  overridden: boolean;
}

/** The last working day before the `n` working days that end on (or just before) `date`. */
function dueBefore(date: IsoDate, n: number): IsoDate {
  return addWorkingDays(lastWorkingDayOnOrBefore(date), -n);
}

export function countBack(targetPublishDate: IsoDate, lengths: StageLengths, overrides: DueOverrides = {}): ScheduledStage[] {
  const counted = new Map<Stage, IsoDate>();
  let due = targetPublishDate;
  for (let i = stages.length - 1; i >= 0; i--) {
    const stage = stages[i]!;
    counted.set(stage, due);
    due = dueBefore(due, lengths[stage]);
  }
  // `due` is now the (virtual) day before the challenge's first working day.
  let previousDue = due;
  return stages.map((stage) => {
    const countedDue = counted.get(stage)!;
    const override = stage === "publish" ? undefined : overrides[stage];
    const row: ScheduledStage = {
      stage,
      lengthDays: lengths[stage],
      start: nextWorkingDayAfter(previousDue),
      due: override ?? countedDue,
      countedDue,
      overridden: override !== undefined,
    };
    previousDue = row.due;
    return row;
  });
}

/**
 * Only the current stage's due date, without building the whole plan: the board asks this of
 * every episode. Equal to `countBack(...)` for that stage, by the same arithmetic.
 */
export function currentStageDue(targetPublishDate: IsoDate, lengths: StageLengths, stage: Stage, override?: IsoDate): IsoDate {
  if (override !== undefined && stage !== "publish") return override;
  if (stage === "publish") return targetPublishDate;
  let after = 0;
  for (let i = stageIndex(stage) + 1; i < stages.length; i++) after += lengths[stages[i]!];
  return dueBefore(targetPublishDate, after);
}

export interface RiskReason {
  /**
   * stage_overdue: the current stage is past its due date and had been entered by then.
   * plan_in_past: the plan needs a date that has gone: the current stage was due before it was even
   * entered, or a stage still ahead should have started before today.
   */
  code: "stage_overdue" | "plan_in_past";
  stage: Stage;
  /** The due date missed, or the start date needed. */
  date: IsoDate;
}

/**
 * Why an episode is at risk today. `enteredOn` is the day the current stage began. An episode in
 * publish whose date has come is out, not late: the publish stage raises no risk.
 */
export function scheduleRisks(schedule: ScheduledStage[], current: Stage, enteredOn: IsoDate, today: IsoDate): RiskReason[] {
  if (current === "publish") return [];
  const here = schedule[stageIndex(current)]!;
  if (here.due < today) return [{ code: enteredOn > here.due ? "plan_in_past" : "stage_overdue", stage: current, date: here.due }];
  const late = schedule.slice(stageIndex(current) + 1).find((row) => row.start < today);
  return late ? [{ code: "plan_in_past", stage: late.stage, date: late.start }] : [];
}

/**
 * The same answer as `scheduleRisks(countBack(...))`, cheaply: without overrides the stages ahead
 * start after the current one is due, so only the current due date matters. The board asks this of
 * thousands of episodes per load.
 */
export function episodeRisks(
  episode: { targetPublishDate: IsoDate | null; stage: Stage; dueOverrides?: DueOverrides },
  lengths: StageLengths,
  enteredOn: IsoDate,
  today: IsoDate,
): RiskReason[] {
  const publish = publishDateOf(episode);
  if (publish === null || episode.stage === "publish") return [];
  const overrides = episode.dueOverrides ?? {};
  if (Object.keys(overrides).length > 0) return scheduleRisks(countBack(publish, lengths, overrides), episode.stage, enteredOn, today);
  const due = currentStageDue(publish, lengths, episode.stage);
  if (due >= today) return [];
  return [{ code: enteredOn > due ? "plan_in_past" : "stage_overdue", stage: episode.stage, date: due }];
}

/**
 * The date an episode goes out, for every feature that counts from it (sponsor deliverables, the
 * calendar): its target publish date, or null while it has none. The publish stage's due date is
 * always this date; it cannot be overridden on its own.
 */
export function publishDateOf(episode: { targetPublishDate: IsoDate | null }): IsoDate | null {
  return episode.targetPublishDate;
}

/** Due date of one stage of an episode, or null without a publish date: the schedule as other features read it. */
export function stageDueDateOf(
  episode: { targetPublishDate: IsoDate | null; dueOverrides?: DueOverrides },
  stage: Stage,
  lengths: StageLengths = defaultStageLengths,
): IsoDate | null {
  const publish = publishDateOf(episode);
  return publish === null ? null : currentStageDue(publish, lengths, stage, episode.dueOverrides?.[stage]);
}
