import { useState } from "react";
import { isMoneyKind } from "@shared/sponsors/deliverables";
import { REVIEW_LINK_DEFAULT_DAYS, type DealView, type ReviewLinkState } from "@shared/sponsors/schemas";
import { Button } from "../../../components/Button";
import { Notice } from "../../../components/Notice";
import { SelectField } from "../../../components/SelectField";
import { TextField } from "../../../components/TextField";
import { ApiError } from "../../../lib/api-client";
import { useRevokeReviewLink, useSendReviewLink } from "../api/review-links";
import { Tag } from "./form-tools";

const stateTone: Record<ReviewLinkState, "neutral" | "warn" | "good" | "alarm"> = { open: "warn", decided: "good", expired: "neutral", revoked: "neutral", closed: "neutral" };
// "Closed": its contact was removed, its deal cancelled, or its item removed or settled.
const stateLabel: Record<ReviewLinkState, string> = { open: "Open", decided: "Decided", expired: "Expired", revoked: "Withdrawn", closed: "Closed" };

/** Review links: one deal, one contact, one decision; sent by e-mail, withdrawn here. */
export function ReviewPanel({ channelId, deal }: { channelId: string; deal: DealView }) {
  const send = useSendReviewLink(channelId, deal.id);
  const revoke = useRevokeReviewLink(channelId, deal.id);
  const reviewable = deal.deliverables.filter((d) => !isMoneyKind(d.kind));
  const preferred = reviewable.find((d) => d.status !== "approved" && d.status !== "done") ?? reviewable[0];
  const [deliverableId, setDeliverableId] = useState(preferred?.id ?? "");
  const [contactId, setContactId] = useState(deal.contact?.id ?? deal.contacts[0]?.id ?? "");
  const [days, setDays] = useState(String(REVIEW_LINK_DEFAULT_DAYS));
  const [sentTo, setSentTo] = useState<string | null>(null);
  const fields = send.error instanceof ApiError ? send.error.fields : {};

  const onSend = async () => {
    setSentTo(null);
    const answer = await send.mutateAsync({ deliverableId, contactId, expiresInDays: Number(days) }).catch(() => null);
    if (answer) setSentTo(`${answer.link.contactName} <${answer.link.contactEmail}>`);
  };

  return (
    <div className="flex flex-col gap-3">
      {deal.contacts.length === 0 ? (
        <Notice>Add a contact to the sponsor first: the link goes to a contact's e-mail.</Notice>
      ) : (
        <div className="flex flex-col gap-3">
          <div className="grid items-start gap-3 sm:grid-cols-2">
            <SelectField label="Item to review" value={deliverableId} onChange={(e) => setDeliverableId(e.target.value)} options={reviewable.map((d) => ({ value: d.id, label: d.title }))} error={fields.deliverableId} />
            <SelectField label="Send to" value={contactId} onChange={(e) => setContactId(e.target.value)} options={deal.contacts.map((c) => ({ value: c.id, label: `${c.name} (${c.email})` }))} error={fields.contactId} />
          </div>
          <div className="flex flex-wrap items-start gap-3">
            <div className="w-36">
              <TextField label="Open for (days)" inputMode="numeric" value={days} onChange={(e) => setDays(e.target.value)} error={fields.expiresInDays} />
            </div>
            <Button className="mt-6" busy={send.isPending} onClick={() => void onSend()} disabled={!deliverableId || !contactId}>
              Send review link
            </Button>
          </div>
        </div>
      )}
      {send.isError && !Object.keys(fields).length && <Notice kind="error">{send.error.message}</Notice>}
      {sentTo && <Notice kind="success">Review link e-mailed to {sentTo}. It works for one decision.</Notice>}
      {revoke.isError && <Notice kind="error">{revoke.error.message}</Notice>}
      {(deal.reviewLinks ?? []).length > 0 && (
        <ul className="divide-y divide-ply-200 rounded-md border border-ply-200 text-sm">
          {deal.reviewLinks!.map((link) => (
            <li key={link.id} className="flex flex-wrap items-center gap-3 px-3 py-2" data-testid="review-link">
              <Tag tone={stateTone[link.state]}>{stateLabel[link.state]}</Tag>
              <span className="flex-1">
                <span className="font-medium">{link.deliverableTitle}</span> to {link.contactName} · sent {new Date(link.sentAt).toLocaleDateString()} by {link.sentByName} · open until{" "}
                {new Date(link.expiresAt).toLocaleDateString()}
                {link.decision && (
                  <span className="block text-graphite-700">
                    {link.decision === "approved" ? "Approved" : "Changes asked"} on {new Date(link.decidedAt!).toLocaleString()}
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
