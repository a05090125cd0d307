import { createHash } from "node:crypto";
import type { Queryable } from "../db/client";
import { AppError } from "../http/app-error";
import { hitsSince, lockScope, recordHit } from "./page.repository";

export interface PageLimits {
  /** Suggestions one address may send one channel's page in the window. */
  perChannel: number;
  /** Suggestions one address may send all pages together in the window. */
  everywhere: number;
  windowMs: number;
}

/**
 * Kerf's own choice, not a published figure: a viewer with several ideas sends a handful in a sitting;
 * more than that from one address is a script. Kept in PostgreSQL, so every instance counts the same.
 */
export const defaultPageLimits: PageLimits = { perChannel: 5, everywhere: 30, windowMs: 15 * 60_000 };

/** Addresses are kept only as a hash: the counters need to tell addresses apart, not know them. */
export const addressKey = (address: string) => createHash("sha256").update(`intake-address:${address}`).digest("hex").slice(0, 32);

/**
 * Counts one submission from `address` to `channelId`, or answers 429. Inside the submission's
 * transaction: the scope locks are held until it ends, so two instances take turns.
 */
export async function takePageHit(tx: Queryable, limits: PageLimits, channelId: string, address: string, now = new Date()): Promise<void> {
  const key = addressKey(address);
  const since = new Date(now.getTime() - limits.windowMs);
  for (const [scope, limit] of [[`all:${key}`, limits.everywhere], [`${channelId}:${key}`, limits.perChannel]] as const) {
    await lockScope(tx, `intake-hits:${scope}`);
    if ((await hitsSince(tx, scope, since)) >= limit) {
      const minutes = Math.ceil(limits.windowMs / 60_000);
      throw new AppError("rate_limited", `Thanks — that's plenty from this network for now. Try again in ${minutes} minutes.`, undefined, { retryAfterSeconds: Math.ceil(limits.windowMs / 1000) });
    }
  }
  for (const scope of [`all:${key}`, `${channelId}:${key}`]) await recordHit(tx, scope, now);
}
