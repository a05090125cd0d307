import { useState } from "react";
import { useForm, useWatch } from "react-hook-form";
import { isMoneyKind } from "@shared/sponsors/deliverables";
import { REVIEW_LINK_DEFAULT_DAYS, sendReviewSchema, type DealView, type ReviewLinkState, type SendReviewInput } from "@shared/sponsors/schemas";
import { Button } from "../../../components/Button";
import { Notice } from "../../../components/Notice";
import { formatInstant, formatInstantDay, formatInstantNamingZone } from "../../../lib/format";
import { useTimeZone } from "../../../lib/session";
import { useRevokeReviewLink } from "../api/revoke-review-link";
import { useSendReviewLink } from "../api/send-review-link";
import { NumberField, SelectField } from "../../../components/form-fields";
import { applyServerErrors, numberFrom } from "../../../lib/forms";
import { schemaResolver } from "../../../lib/schema-resolver";
import { Tag } from "./labels";

const stateTone: Record<ReviewLinkState, "neutral" | "warn" | "good" | "alarm"> = { open: "warn", decided: "good", expired: "neutral", revoked: "neutral", closed: "neutral" };
// "Closed": its contact was removed, its deal cancelled, or its item removed or settled.
const stateLabel: Record<ReviewLinkState, string> = { open: "Open", decided: "Decided", expired: "Expired", revoked: "Withdrawn", closed: "Closed" };

interface SendValues {
  deliverableId: string;
  contactId: string;
  expiresInDays: string;
}

const sendResolver = schemaResolver(sendReviewSchema, (v: SendValues) => ({ ...v, expiresInDays: numberFrom(v.expiresInDays) }));

/** Review links: one deal, one contact, one decision; sent by e-mail, withdrawn here. */
export function ReviewPanel({ channelId, deal }: { channelId: string; deal: DealView }) {
  const send = useSendReviewLink(channelId, deal.id);
  const revoke = useRevokeReviewLink(channelId, deal.id);
  const reviewable = deal.deliverables.filter((d) => !isMoneyKind(d.kind));
  const preferred = reviewable.find((d) => d.status !== "approved" && d.status !== "done") ?? reviewable[0];
  const [sentTo, setSentTo] = useState<string | null>(null);
  const [formError, setFormError] = useState<string | null>(null);
  const timeZone = useTimeZone();
  const form = useForm<SendValues, unknown, SendReviewInput>({
    resolver: sendResolver,
    defaultValues: { deliverableId: preferred?.id ?? "", contactId: deal.contact?.id ?? deal.contacts[0]?.id ?? "", expiresInDays: String(REVIEW_LINK_DEFAULT_DAYS) },
  });
  const [deliverableId, contactId] = useWatch({ control: form.control, name: ["deliverableId", "contactId"] });
  const errors = form.formState.errors;

  const onSend = form.handleSubmit(async (body) => {
    setSentTo(null);
    setFormError(null);
    try {
      const answer = await send.mutateAsync(body);
      setSentTo(`${answer.link.contactName} <${answer.link.contactEmail}>`);
    } catch (error) {
      setFormError(applyServerErrors(error, form.setError, ["deliverableId", "contactId", "expiresInDays"]));
    }
  });

  return (
    <div className="flex flex-col gap-3">
      {deal.contacts.length === 0 ? (
        <Notice>Add a contact to the sponsor first: the link goes to a contact's e-mail.</Notice>
      ) : (
        <form onSubmit={onSend} noValidate aria-label="Send a review link" className="flex flex-col gap-3">
          <div className="grid items-start gap-3 sm:grid-cols-2">
            <SelectField label="Item to review" options={reviewable.map((d) => ({ value: d.id, label: d.title }))} {...form.register("deliverableId")} error={errors.deliverableId?.message} />
            <SelectField label="Send to" options={deal.contacts.map((c) => ({ value: c.id, label: `${c.name} (${c.email})` }))} {...form.register("contactId")} error={errors.contactId?.message} />
          </div>
          <div className="flex flex-wrap items-start gap-3">
            <div className="w-36">
              <NumberField whole label="Open for (days)" {...form.register("expiresInDays")} error={errors.expiresInDays?.message} />
            </div>
            <Button type="submit" className="mt-6" busy={send.isPending} disabled={!deliverableId || !contactId}>
              Send review link
            </Button>
          </div>
        </form>
      )}
      {formError && <Notice kind="error">{formError}</Notice>}
      {sentTo && <Notice kind="success">Review link e-mailed to {sentTo}. It works for one decision.</Notice>}
      {revoke.isError && <Notice kind="error">{revoke.error.message}</Notice>}
      {(deal.reviewLinks ?? []).length > 0 && (
        <ul className="divide-y divide-ply-200 rounded-md border border-ply-200 text-sm">
          {deal.reviewLinks!.map((link) => (
            <li key={link.id} className="flex flex-wrap items-center gap-3 px-3 py-2" data-testid="review-link">
              <Tag tone={stateTone[link.state]}>{stateLabel[link.state]}</Tag>
              <span className="flex-1">
                <span className="font-medium">{link.deliverableTitle}</span> to {link.contactName} · sent {formatInstantDay(link.sentAt, timeZone)} by {link.sentByName} · open until{" "}
                {formatInstantNamingZone(link.expiresAt, timeZone)}
                {link.decision && (
                  <span className="block text-graphite-700">
                    {link.decision === "approved" ? "Approved" : "Changes asked"} on {formatInstant(link.decidedAt!, timeZone)}
                    {link.comment ? `: “${link.comment}”` : ""}
                  </span>
                )}
              </span>
              {link.state === "open" && (
                <Button tone="quiet" className="px-2 py-1" busy={revoke.isPending && revoke.variables === link.id} onClick={() => revoke.mutate(link.id)}>
                  Withdraw
                </Button>
              )}
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
