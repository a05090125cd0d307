import { createHmac, timingSafeEqual } from "node:crypto";
import { isSettled, type DeliverableStatus } from "../../shared/sponsors/deliverables";
import type { DealState, ReviewLinkState } from "../../shared/sponsors/schemas";

/**
 * A sponsor's review link carries `<link id>.<expiry>.<signature>`: the signature is an HMAC-SHA-256
 * (RFC 2104) over the id and the expiry, keyed from the server's session secret with a label of its own
 * (so a review signature can never stand in for anything else the secret signs). A forged or altered
 * token fails before the database is asked; the row then says whether the link was revoked, used or
 * has expired. The token is never stored: only the row's id is in it.
 */
const LABEL = "kerf/review-link/v1";

export interface ReviewTokens {
  sign(linkId: string, expiresAt: Date): string;
  /** The link id and expiry a genuine token names; null for anything else. */
  verify(token: string): { linkId: string; expiresAt: Date } | null;
}

export const reviewTokens = (secret: string): ReviewTokens => signedTokens(secret, LABEL);

/** The sponsor's report: the link mailed to the contact, and the short one its PDF job prints the page through. */
export const reportTokens = (secret: string) => ({ link: signedTokens(secret, "kerf/sponsor-report/v1"), print: signedTokens(secret, "kerf/sponsor-report-print/v1") });

/** Tokens of the same shape for another purpose: the label keys them apart, so one never stands in for another. */
export function signedTokens(secret: string, label: string): ReviewTokens {
  const key = createHmac("sha256", secret).update(label).digest();
  const signature = (payload: string) => createHmac("sha256", key).update(payload).digest("base64url");
  return {
    sign(linkId, expiresAt) {
      const payload = `${linkId.replaceAll("-", "")}.${Math.floor(expiresAt.getTime() / 1000)}`;
      return `${payload}.${signature(payload)}`;
    },
    verify(token) {
      const match = /^([0-9a-f]{32})\.(\d{1,12})\.([A-Za-z0-9_-]{43})$/.exec(token);
      if (!match) return null;
      const [, hex, seconds, sent] = match as unknown as [string, string, string, string];
      const expected = Buffer.from(signature(`${hex}.${seconds}`));
      const given = Buffer.from(sent);
      if (expected.length !== given.length || !timingSafeEqual(expected, given)) return null;
      const linkId = `${hex.slice(0, 8)}-${hex.slice(8, 12)}-${hex.slice(12, 16)}-${hex.slice(16, 20)}-${hex.slice(20)}`;
      return { linkId, expiresAt: new Date(Number(seconds) * 1000) };
    },
  };
}

/** A link's state from its row; revocation wins over a decision, a decision over expiry. */
export function reviewStateOf(link: { revokedAt: Date | null; decidedAt: Date | null; expiresAt: Date }, now = new Date()): ReviewLinkState {
  if (link.revokedAt) return "revoked";
  if (link.decidedAt) return "decided";
  if (link.expiresAt.getTime() <= now.getTime()) return "expired";
  return "open";
}

/** Why a link closed with what it belongs to. */
export type ReviewClosure = "item_removed" | "deal_cancelled" | "contact_removed" | "item_settled";

/** What a link belongs to, as it is now: its contact (null once removed), its deal, its item (null once removed). */
export interface ReviewSubject {
  contactId: string | null;
  dealState: DealState;
  itemStatus: DeliverableStatus | null;
}

export function closureOf(subject: ReviewSubject): ReviewClosure | null {
  if (subject.itemStatus === null) return "item_removed";
  if (subject.dealState === "cancelled") return "deal_cancelled";
  if (subject.contactId === null) return "contact_removed";
  if (isSettled(subject.itemStatus)) return "item_settled";
  return null;
}

/** A link's state with what it belongs to: a withdrawn or used link stays so; otherwise it closes with its contact, deal or item. */
export function linkStateOf(link: Parameters<typeof reviewStateOf>[0], subject: ReviewSubject, now = new Date()): ReviewLinkState {
  const own = reviewStateOf(link, now);
  return own !== "revoked" && own !== "decided" && closureOf(subject) ? "closed" : own;
}
