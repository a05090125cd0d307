import { Fragment, useState } from "react";
import { useForm, useWatch } from "react-hook-form";
import { anchorLabels, anchors, describeDating, deliverableKindLabels, deliverableKinds, deliverableStatusLabels, deliverableStatuses, type DeliverableStatus } from "@shared/sponsors/deliverables";
import { newDeliverableSchema, type DealView, type DeliverableEvent, type DeliverableView } from "@shared/sponsors/schemas";
import { Button } from "../../../components/Button";
import { FormOpener } from "../../../components/FormOpener";
import { Notice } from "../../../components/Notice";
import { DAY_MS, formatDay, formatDuration, formatInstant } from "../../../lib/format";
import { useTimeZone } from "../../../lib/session";
import { useAddDeliverable } from "../api/add-deliverable";
import { useRemoveDeliverable } from "../api/remove-deliverable";
import { useUpdateDeliverable } from "../api/update-deliverable";
import { useSponsorSettings } from "../api/get-settings";
import { StatusTag } from "./labels";
import { FormActions, SelectField, TextField } from "../../../components/form-fields";
import { applyServerErrors, numberFrom } from "../../../lib/forms";
import { schemaResolver } from "../../../lib/schema-resolver";
import { Tag } from "./labels";

function whenOf(item: DeliverableView): string {
  return item.anchor === "fixed" ? "set by hand" : describeDating(item.anchor, item.offsetDays);
}

function describe(event: DeliverableEvent): string {
  switch (event.what) {
    case "created":
      return `created${event.toDate ? `, due ${formatDay(event.toDate)}` : ""}${event.note ? ` (${event.note})` : ""}`;
    case "status":
    case "review_decision":
      return `${event.what === "review_decision" ? "decided: " : ""}${label(event.fromStatus)} → ${label(event.toStatus)}${event.note ? `: “${event.note}”` : ""}`;
    case "due_moved":
      return `due ${formatDay(event.fromDate) || "no date"} → ${formatDay(event.toDate) || "no date"}${event.note ? ` (${event.note})` : ""}`;
    case "owner":
      return "changed the owner";
    default:
      return event.note ?? event.what;
  }
}

const label = (status: string | null) => (status ? (deliverableStatusLabels[status as DeliverableStatus] ?? status) : "—");

/** The deal's items: dates, status, owner and history. Owners and producers change them; the editor moves the cut items. */
export function DeliverablesPanel({ channelId, deal, canManage }: { channelId: string; deal: DealView; canManage: boolean }) {
  const update = useUpdateDeliverable(channelId);
  const remove = useRemoveDeliverable(channelId);
  const settings = useSponsorSettings(channelId);
  const [open, setOpen] = useState<string | null>(null);
  const members = settings.data?.hosts ?? [];
  const timeZone = useTimeZone();

  return (
    <div className="flex flex-col gap-3">
      {update.isError && <Notice kind="error">{update.error.message}</Notice>}
      {deal.deliverables.length === 0 ? (
        <p className="text-sm text-graphite-500">No items yet.{canManage ? " Add the contract's items below." : ""}</p>
      ) : (
        <div className="overflow-x-auto">
          <table className="w-full text-left text-sm">
            <thead className="text-xs uppercase tracking-wide text-graphite-500">
              <tr>
                <th className="py-1 pr-3">Item</th>
                <th className="py-1 pr-3">Due</th>
                <th className="py-1 pr-3">Status</th>
                <th className="py-1 pr-3">Owner</th>
                <th className="py-1" />
              </tr>
            </thead>
            <tbody className="divide-y divide-ply-200">
              {deal.deliverables.map((item) => (
                <Fragment key={item.id}>
                  <tr className={item.late ? "bg-alarm-600/5" : undefined} data-testid={`item-${item.kind}`}>
                    <td className="py-2 pr-3">
                      <p className="font-medium">{item.title}</p>
                      <p className="text-xs text-graphite-500">{deliverableKindLabels[item.kind]}</p>
                    </td>
                    <td className="py-2 pr-3">
                      <p className="font-medium" data-testid="due-date">
                        {item.dueDate ? <time dateTime={item.dueDate}>{formatDay(item.dueDate)}</time> : item.anchor === "fixed" ? "No date yet" : "Waiting for a publish date"}
                      </p>
                      <p className="text-xs text-graphite-500">{whenOf(item)}</p>
                    </td>
                    <td className="py-2 pr-3">
                      {item.canEdit ? (
                        <div className="flex flex-col gap-1">
                          <label className="sr-only" htmlFor={`status-${item.id}`}>
                            Status of {item.title}
                          </label>
                          <select
                            id={`status-${item.id}`}
                            value={item.status}
                            onChange={(e) => update.mutate({ id: item.id, input: { status: e.target.value as DeliverableStatus, version: item.version } })}
                            className="rounded-md border border-ply-300 bg-white px-2 py-1"
                          >
                            {deliverableStatuses.map((s) => (
                              <option key={s} value={s}>
                                {deliverableStatusLabels[s]}
                              </option>
                            ))}
                          </select>
                          {item.late && <Tag tone="alarm">Late by {formatDuration(item.daysLate * DAY_MS, { smallest: "d" })}</Tag>}
                        </div>
                      ) : (
                        <StatusTag status={item.status} late={item.late} daysLate={item.daysLate} />
                      )}
                    </td>
                    <td className="py-2 pr-3">
                      {canManage ? (
                        <>
                          <label className="sr-only" htmlFor={`owner-${item.id}`}>
                            Owner of {item.title}
                          </label>
                          <select
                            id={`owner-${item.id}`}
                            value={item.ownerId ?? ""}
                            onChange={(e) => update.mutate({ id: item.id, input: { ownerId: e.target.value || null, version: item.version } })}
                            className="max-w-40 rounded-md border border-ply-300 bg-white px-2 py-1"
                          >
                            <option value="">No owner</option>
                            {members.map((m) => (
                              <option key={m.userId} value={m.userId}>
                                {m.name}
                              </option>
                            ))}
                          </select>
                        </>
                      ) : (
                        (item.ownerName ?? "No owner")
                      )}
                    </td>
                    <td className="py-2 text-right whitespace-nowrap">
                      <Button tone="quiet" className="px-2 py-1" aria-expanded={open === item.id} onClick={() => setOpen(open === item.id ? null : item.id)}>
                        History
                      </Button>
                      {canManage && (
                        <Button
                          tone="danger"
                          className="ml-1 px-2 py-1"
                          aria-label={`Remove ${item.title}`}
                          onClick={() => {
                            if (window.confirm(`Remove "${item.title}" from this deal?`)) remove.mutate(item.id);
                          }}
                        >
                          ✕
                        </Button>
                      )}
                    </td>
                  </tr>
                  {open === item.id && (
                    <tr>
                      <td colSpan={5} className="bg-ply-50 px-3 py-2">
                        <ol className="flex flex-col gap-1 text-xs">
                          {item.history.map((e) => (
                            <li key={e.id}>
                              <time dateTime={e.at} className="text-graphite-500">
                                {formatInstant(e.at, timeZone)}
                              </time>{" "}
                              <span className="font-medium">{e.actorName}</span>
                              {e.actorKind === "sponsor" ? " (sponsor)" : ""} {describe(e)}
                            </li>
                          ))}
                        </ol>
                      </td>
                    </tr>
                  )}
                </Fragment>
              ))}
            </tbody>
          </table>
        </div>
      )}
      {canManage && (
        <FormOpener label="Add an item" tone="quiet">
          {(close) => <AddItemForm channelId={channelId} dealId={deal.id} members={members} onDone={close} />}
        </FormOpener>
      )}
    </div>
  );
}

interface ItemForm {
  kind: string;
  title: string;
  anchor: string;
  offsetDays: string;
  fixedDate: string;
  ownerId: string;
}

function AddItemForm({ channelId, dealId, members, onDone }: { channelId: string; dealId: string; members: { userId: string; name: string }[]; onDone: () => void }) {
  const add = useAddDeliverable(channelId, dealId);
  const [formError, setFormError] = useState<string | null>(null);
  const form = useForm<ItemForm, unknown, ReturnType<typeof newDeliverableSchema.parse>>({
    resolver: schemaResolver(newDeliverableSchema, (v: ItemForm) => ({
      kind: v.kind,
      title: v.title,
      anchor: v.anchor,
      offsetDays: v.anchor === "fixed" ? 0 : numberFrom(v.offsetDays),
      fixedDate: v.anchor === "fixed" ? v.fixedDate : null,
      ownerId: v.ownerId || null,
    })),
    defaultValues: { kind: "other", title: "", anchor: "before_publish", offsetDays: "7", fixedDate: "", ownerId: "" },
  });
  const anchor = useWatch({ control: form.control, name: "anchor" });
  const errors = form.formState.errors;
  const onSubmit = form.handleSubmit(async (body) => {
    setFormError(null);
    try {
      await add.mutateAsync(body);
      onDone();
    } catch (error) {
      setFormError(applyServerErrors(error, form.setError, ["kind", "title", "anchor", "offsetDays", "fixedDate", "ownerId"]));
    }
  });
  return (
    <form onSubmit={onSubmit} noValidate aria-label="Add an item" className="grid gap-3 rounded-md border border-ply-200 p-3 sm:grid-cols-3">
      {formError && (
        <div className="sm:col-span-3">
          <Notice kind="error">{formError}</Notice>
        </div>
      )}
      <SelectField label="Kind" options={deliverableKinds.map((k) => ({ value: k, label: deliverableKindLabels[k] }))} {...form.register("kind")} error={errors.kind?.message} />
      <TextField label="Item" {...form.register("title")} error={errors.title?.message} />
      <SelectField label="Dated" options={anchors.map((a) => ({ value: a, label: anchorLabels[a] }))} {...form.register("anchor")} error={errors.anchor?.message} />
      {anchor === "fixed" ? (
        <TextField label="Date" type="date" {...form.register("fixedDate")} error={errors.fixedDate?.message} />
      ) : (
        <TextField label="Days" inputMode="numeric" {...form.register("offsetDays")} error={errors.offsetDays?.message} />
      )}
      <SelectField label="Owner" options={[{ value: "", label: "Me" }, ...members.map((m) => ({ value: m.userId, label: m.name }))]} {...form.register("ownerId")} error={errors.ownerId?.message} />
      <FormActions className="flex items-end gap-2" submit="Add item" busy={add.isPending} onCancel={onDone} />
    </form>
  );
}
