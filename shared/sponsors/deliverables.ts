import { type IsoDate, daysBetween, shiftDate } from "./dates";

/** What a sponsor contract asks for, in the order a deal usually meets them. */
export const deliverableKinds = [
  "script_draft",
  "script_approval",
  "draft_cut",
  "final_approval",
  "go_live",
  "report",
  "invoice",
  "payment",
  "other",
] as const;
export type DeliverableKind = (typeof deliverableKinds)[number];

export const deliverableKindLabels: Record<DeliverableKind, string> = {
  script_draft: "Script draft",
  script_approval: "Script approval",
  draft_cut: "Draft cut of the segment",
  final_approval: "Final approval",
  go_live: "Go-live",
  report: "Figures report",
  invoice: "Invoice",
  payment: "Payment",
  other: "Other item",
};

/** Items about money: shown only to roles that see the fee (the "fees" area). */
export const moneyKinds: readonly DeliverableKind[] = ["invoice", "payment"];
/** Items the editor delivers, so an editor may move their status. */
export const cutKinds: readonly DeliverableKind[] = ["draft_cut"];

export const isMoneyKind = (kind: DeliverableKind) => moneyKinds.includes(kind);
export const isCutKind = (kind: DeliverableKind) => cutKinds.includes(kind);

export const deliverableStatuses = ["not_started", "sent", "changes_asked", "approved", "done"] as const;
export type DeliverableStatus = (typeof deliverableStatuses)[number];

export const deliverableStatusLabels: Record<DeliverableStatus, string> = {
  not_started: "Not started",
  sent: "Sent",
  changes_asked: "Changes asked",
  approved: "Approved",
  done: "Done",
};

/** How a gate or a message says where an open item stands, in a sentence. */
export const openStatusPhrases: Record<DeliverableStatus, string> = {
  not_started: "has not been started",
  sent: "was sent and waits on the sponsor",
  changes_asked: "came back: changes were asked",
  approved: "is approved",
  done: "is done",
};

/**
 * An approved or done item has happened: it is never late and its date no longer moves. (Approval is
 * the end of an approval item; asking for a separate "done" after the sponsor approved would be busywork.)
 */
export function isSettled(status: DeliverableStatus): boolean {
  return status === "approved" || status === "done";
}

/** "sent" means the item is with the sponsor: the desk lists it as waiting on them. */
export const waitsOnSponsor = (status: DeliverableStatus) => status === "sent";

/** How an item's date is counted: back from the publish date, forward from go-live, or a date set by hand. */
export const anchors = ["before_publish", "after_go_live", "fixed"] as const;
export type Anchor = (typeof anchors)[number];
export const templateAnchors = ["before_publish", "after_go_live"] as const;
export type TemplateAnchor = (typeof templateAnchors)[number];

export const anchorLabels: Record<Anchor, string> = {
  before_publish: "days before publish",
  after_go_live: "days after go-live",
  fixed: "fixed date",
};

/** "3 days before publish", "1 day after go-live", "fixed date". */
export function describeDating(anchor: Anchor, offsetDays: number): string {
  if (anchor === "fixed") return anchorLabels.fixed;
  const unit = offsetDays === 1 ? "day" : "days";
  return `${offsetDays} ${unit} ${anchor === "before_publish" ? "before publish" : "after go-live"}`;
}

export interface ScheduleBasis {
  /** The episode's target publish date. */
  publishDate: IsoDate | null;
  /** The deal's own go-live date, when it differs from the publish date. */
  goLiveDate: IsoDate | null;
}

/** Go-live is the publish date unless the deal names its own. */
export function goLiveOf(basis: ScheduleBasis): IsoDate | null {
  return basis.goLiveDate ?? basis.publishDate;
}

export interface DatedItem {
  anchor: Anchor;
  offsetDays: number;
  /** The date of a fixed item. */
  fixedDate?: IsoDate | null;
}

/** An item's due date; null while the date it counts from is unknown. */
export function dueDateFor(item: DatedItem, basis: ScheduleBasis): IsoDate | null {
  switch (item.anchor) {
    case "before_publish":
      return basis.publishDate === null ? null : shiftDate(basis.publishDate, -item.offsetDays);
    case "after_go_live": {
      const goLive = goLiveOf(basis);
      return goLive === null ? null : shiftDate(goLive, item.offsetDays);
    }
    case "fixed":
      return item.fixedDate ?? null;
  }
}

export interface TemplateItem {
  kind: DeliverableKind;
  title: string;
  anchor: TemplateAnchor;
  offsetDays: number;
  /** Who usually does it; the deal picks a member with this role as the item's owner. */
  ownerRole: "owner" | "producer" | "editor" | null;
  /**
   * The position (in the same template) of the item this one is the sponsor's approval of: when the
   * sponsor approves that item through a review link, this one is approved with it.
   */
  approves?: number | null;
}

export interface GeneratedItem extends TemplateItem {
  dueDate: IsoDate | null;
  position: number;
}

/** A deal's deliverables from its template, each dated from the episode's publish date or the go-live. */
export function generateDeliverables(items: readonly TemplateItem[], basis: ScheduleBasis): GeneratedItem[] {
  return items.map((item, position) => ({ ...item, position, dueDate: dueDateFor(item, basis) }));
}

/**
 * Gives generated items their ids and links each approval item to the item it approves, by the
 * template's positions: rows inserted together can then name each other. A pairing that points
 * nowhere (or at the item itself) is dropped.
 */
export function pairedByTemplate<T extends { approves?: number | null }>(items: readonly T[], ids: readonly string[]): (T & { id: string; approvesId: string | null })[] {
  return items.map((item, index) => {
    const target = item.approves ?? null;
    const approvesId = target !== null && target !== index ? (ids[target] ?? null) : null;
    return { ...item, id: ids[index]!, approvesId };
  });
}

export interface MovableItem extends DatedItem {
  id: string;
  status: DeliverableStatus;
  dueDate: IsoDate | null;
}

export interface DateChange {
  id: string;
  from: IsoDate | null;
  to: IsoDate | null;
}

/**
 * When the publish date (or go-live) moves, every open item counted from it moves by the same
 * offsets; settled items and items with a date set by hand keep theirs.
 */
export function followedDueDates(items: readonly MovableItem[], basis: ScheduleBasis): DateChange[] {
  const changes: DateChange[] = [];
  for (const item of items) {
    if (isSettled(item.status) || item.anchor === "fixed") continue;
    const to = dueDateFor(item, basis);
    if (to !== item.dueDate) changes.push({ id: item.id, from: item.dueDate, to });
  }
  return changes;
}

export interface Lateness {
  late: boolean;
  /** Whole days past the due date; 0 when not late. */
  daysLate: number;
}

/** Late is computed, never stored: an open item whose due date is before today. */
export function latenessOf(item: { status: DeliverableStatus; dueDate: IsoDate | null }, today: IsoDate): Lateness {
  if (item.dueDate === null || isSettled(item.status)) return { late: false, daysLate: 0 };
  const days = daysBetween(item.dueDate, today);
  return days > 0 ? { late: true, daysLate: days } : { late: false, daysLate: 0 };
}

export const deskGroups = ["overdue", "changes_asked", "due_soon", "waiting", "later"] as const;
export type DeskGroup = (typeof deskGroups)[number];

export const deskGroupLabels: Record<DeskGroup, string> = {
  overdue: "Overdue",
  changes_asked: "The sponsor asked for changes",
  due_soon: "Due in the next 7 days",
  waiting: "Waiting on the sponsor",
  later: "Later",
};

/** The desk's window for "due soon", in days from today (today included). */
export const DUE_SOON_DAYS = 7;

/**
 * One group per open item, in this precedence: overdue first (it needs action whoever holds it), then
 * changes the sponsor asked for (the ball is back with the channel now, whatever the due date), then
 * waiting on the sponsor (the ball is in their court), then due in the next seven days, then later
 * (including items with no date yet). Settled items are not on the desk: null.
 */
export function deskGroupOf(item: { status: DeliverableStatus; dueDate: IsoDate | null }, today: IsoDate): DeskGroup | null {
  if (isSettled(item.status)) return null;
  if (latenessOf(item, today).late) return "overdue";
  if (item.status === "changes_asked") return "changes_asked";
  if (waitsOnSponsor(item.status)) return "waiting";
  if (item.dueDate !== null && daysBetween(today, item.dueDate) <= DUE_SOON_DAYS) return "due_soon";
  return "later";
}

export type ReminderKind = "before" | "late";

/**
 * Which reminder an item calls for today: "before" from `daysBefore` days ahead of the due date up
 * to the due date itself, "late" once the due date has passed. The caller records each
 * (item, kind, due date) once, so each goes out once; a moved date earns fresh reminders.
 */
export function reminderFor(item: { status: DeliverableStatus; dueDate: IsoDate | null }, today: IsoDate, daysBefore: number): ReminderKind | null {
  if (item.dueDate === null || isSettled(item.status)) return null;
  const daysLeft = daysBetween(today, item.dueDate);
  if (daysLeft < 0) return "late";
  if (daysLeft <= daysBefore) return "before";
  return null;
}

/**
 * A starting point for a channel's first template. The offsets are Kerf's own suggestion (common
 * practice in the sense of "a workable default", not from a published source); every channel edits them.
 */
export const suggestedTemplateItems: TemplateItem[] = [
  { kind: "script_draft", title: "Script draft to the sponsor", anchor: "before_publish", offsetDays: 21, ownerRole: "producer" },
  { kind: "script_approval", title: "Sponsor approves the script", anchor: "before_publish", offsetDays: 14, ownerRole: "producer", approves: 0 },
  { kind: "draft_cut", title: "Draft cut of the segment to the sponsor", anchor: "before_publish", offsetDays: 7, ownerRole: "editor" },
  { kind: "final_approval", title: "Sponsor's final approval", anchor: "before_publish", offsetDays: 3, ownerRole: "producer", approves: 2 },
  { kind: "go_live", title: "Video goes live", anchor: "after_go_live", offsetDays: 0, ownerRole: "owner" },
  { kind: "report", title: "Figures report to the sponsor", anchor: "after_go_live", offsetDays: 30, ownerRole: "producer" },
  { kind: "invoice", title: "Invoice the sponsor", anchor: "after_go_live", offsetDays: 1, ownerRole: "producer" },
  { kind: "payment", title: "Payment received", anchor: "after_go_live", offsetDays: 31, ownerRole: "producer" },
];
