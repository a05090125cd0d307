import type { z } from "zod";
import { dueDateFor, isCutKind, isMoneyKind } from "../../shared/sponsors/deliverables";
import type { newDeliverableSchema, updateDeliverableSchema } from "../../shared/sponsors/schemas";
import { isMember } from "../db/channel-scope";
import type { Database } from "../db/client";
import { AppError, notFound, staleSave } from "../http/app-error";
import type { Caller } from "../http/route-table";
import { deleteDeliverableRow, findDeal, findDeliverable, insertDeliverables, insertEvents, nextPosition, openPairedItems, updateDeliverableRow, type Db, type NewEvent } from "./deals.repository";
import { dealView, deliversCut, eventBy, runsDeliverables, seesFees } from "./deals.service";

async function checkOwner(db: Database, channelId: string, ownerId: string | null | undefined) {
  if (ownerId && !(await isMember(db, channelId, ownerId))) {
    throw new AppError("validation_failed", "Some fields need attention.", { ownerId: "Pick a member of this channel." });
  }
}

export async function addDeliverable(db: Database, caller: Caller, dealId: string, input: z.output<typeof newDeliverableSchema>) {
  const deal = await findDeal(db, caller.channelId, dealId);
  if (!deal) throw notFound("Deal");
  await checkOwner(db, caller.channelId, input.ownerId);
  const dueDate = dueDateFor(input, { publishDate: deal.publishDate, goLiveDate: deal.deal.goLiveDate });
  return db.transaction(async (tx) => {
    const [item] = await insertDeliverables(tx, [
      {
        channelId: caller.channelId,
        dealId,
        kind: input.kind,
        title: input.title,
        anchor: input.anchor,
        offsetDays: input.anchor === "fixed" ? 0 : input.offsetDays,
        dueDate,
        ownerId: input.ownerId ?? caller.userId,
        position: await nextPosition(tx, caller.channelId, dealId),
      },
    ]);
    await insertEvents(tx, [
      { ...eventBy(caller, item!.id), what: "created", toStatus: item!.status, toDate: dueDate },
    ]);
    return dealView(tx, caller, dealId);
  });
}

/**
 * Roles that run deliverables change anything on an item; a role that only delivers the cut (the
 * editor) changes only the status (and adds a note) of the cut items; the route lets no one else in.
 * Money items don't exist for roles that can't see fees.
 */
export async function updateDeliverable(db: Database, caller: Caller, deliverableId: string, version: number, input: z.output<typeof updateDeliverableSchema>) {
  const found = await findDeliverable(db, caller.channelId, deliverableId);
  if (!found || (isMoneyKind(found.item.kind) && !seesFees(caller.role))) throw notFound("Deliverable");
  const item = found.item;
  if (!runsDeliverables(caller.role)) {
    const onlyStatus = Object.keys(input).every((key) => key === "status" || key === "note");
    if (!(deliversCut(caller.role) && isCutKind(item.kind))) throw new AppError("forbidden", "Your role may read this item but not change it.");
    if (!onlyStatus) throw new AppError("forbidden", "An editor can change the status of the cut items they deliver, not their dates, owner or title.");
  }
  const stale = async (tx: Db) => staleSave("item", await dealView(tx, caller, item.dealId));
  if (item.version !== version) throw await stale(db);
  await checkOwner(db, caller.channelId, input.ownerId);

  const deal = await findDeal(db, caller.channelId, item.dealId);
  const anchor = input.anchor ?? item.anchor;
  const datingChanged = input.anchor !== undefined || input.offsetDays !== undefined || input.fixedDate !== undefined;
  if (anchor === "fixed" && datingChanged && !input.fixedDate && item.anchor !== "fixed") {
    throw new AppError("validation_failed", "Some fields need attention.", { fixedDate: "Enter the date." });
  }
  const offsetDays = anchor === "fixed" ? 0 : (input.offsetDays ?? item.offsetDays);
  const dueDate = datingChanged
    ? dueDateFor({ anchor, offsetDays, fixedDate: input.fixedDate ?? item.dueDate }, { publishDate: deal?.publishDate ?? null, goLiveDate: deal?.deal.goLiveDate ?? null })
    : item.dueDate;

  const base = eventBy(caller, deliverableId);
  const events: NewEvent[] = [];
  if (input.status !== undefined && input.status !== item.status) events.push({ ...base, what: "status", fromStatus: item.status, toStatus: input.status, note: input.note ?? null });
  if (input.ownerId !== undefined && input.ownerId !== item.ownerId) events.push({ ...base, what: "owner", note: null });
  if (dueDate !== item.dueDate) events.push({ ...base, what: "due_moved", fromDate: item.dueDate, toDate: dueDate, note: null });
  if (input.title !== undefined && input.title !== item.title) events.push({ ...base, what: "edited", note: `Renamed from "${item.title}"` });
  if (input.note && !events.some((e) => e.what === "status")) events.push({ ...base, what: "note", note: input.note });

  return db.transaction(async (tx) => {
    const saved = await updateDeliverableRow(tx, caller.channelId, deliverableId, { title: input.title, status: input.status, ownerId: input.ownerId, anchor, offsetDays, dueDate }, version);
    if (!saved) throw await stale(tx);
    await insertEvents(tx, events);
    return dealView(tx, caller, item.dealId);
  });
}

export async function removeDeliverable(db: Database, caller: Caller, deliverableId: string) {
  const found = await findDeliverable(db, caller.channelId, deliverableId);
  if (!found) throw notFound("Deliverable");
  await deleteDeliverableRow(db, caller.channelId, deliverableId);
}

/** Who an item's history names for a change: a member, the sponsor's contact, or Kerf itself. */
export type EventActor = Pick<NewEvent, "channelId" | "actorId" | "actorName" | "actorKind">;

/**
 * The sponsor approved an item: the items the deal's template pairs with it (its approval item, or the
 * item it is the approval of) are approved with it, each with a line in its history. Run inside the
 * transaction that records the approval.
 */
export async function approvePairedItems(tx: Db, actor: EventActor, approved: { id: string; title: string }) {
  const paired = await openPairedItems(tx, actor.channelId, approved.id);
  for (const item of paired) await updateDeliverableRow(tx, actor.channelId, item.id, { status: "approved" });
  await insertEvents(
    tx,
    paired.map((item) => ({ ...actor, deliverableId: item.id, what: "status" as const, fromStatus: item.status, toStatus: "approved", note: `Approved with "${approved.title}"` })),
  );
}
