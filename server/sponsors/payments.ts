import Stripe from "stripe";
import type { Env } from "../env";
import { AppError } from "../http/app-error";

/**
 * The payments provider, reached only through its official SDK: the provider's own API, or any
 * address that speaks it (the local stand-in) from PAYMENTS_API_URL. Null when no key is set.
 */
export interface Payments {
  stripe: Stripe;
  webhookSecret: string;
}

/** The provider's documented default tolerance for a webhook signature's timestamp, in seconds. */
export const WEBHOOK_TOLERANCE_SECONDS = 300;

export function paymentsFrom(env: Pick<Env, "PAYMENTS_API_URL" | "PAYMENTS_SECRET_KEY" | "PAYMENTS_WEBHOOK_SECRET">): Payments | null {
  if (!env.PAYMENTS_SECRET_KEY) return null;
  const url = env.PAYMENTS_API_URL ? new URL(env.PAYMENTS_API_URL) : null;
  const at = url ? { host: url.hostname, port: Number(url.port || (url.protocol === "https:" ? 443 : 80)), protocol: url.protocol === "https:" ? ("https" as const) : ("http" as const) } : {};
  // Retries reuse the SDK's idempotency key, so a retried create never makes two.
  return { stripe: new Stripe(env.PAYMENTS_SECRET_KEY, { ...at, maxNetworkRetries: 2, timeout: 15_000 }), webhookSecret: env.PAYMENTS_WEBHOOK_SECRET };
}

export function requirePayments(payments: Payments | null): Payments {
  if (!payments) throw new AppError("unavailable", "Invoicing is not set up on this server: it needs the payments provider's key.");
  return payments;
}

/** A provider call: its refusals become a 409 in the provider's words, an unreachable provider a 503. */
export async function viaProvider<T>(work: () => Promise<T>): Promise<T> {
  try {
    return await work();
  } catch (error) {
    if (error instanceof Stripe.errors.StripeConnectionError || error instanceof Stripe.errors.StripeAPIError) {
      throw new AppError("unavailable", "The payments provider can't be reached just now. Nothing was changed; try again in a minute.");
    }
    if (error instanceof Stripe.errors.StripeInvalidRequestError || error instanceof Stripe.errors.StripeCardError) {
      throw new AppError("conflict", `The payments provider refused this: ${error.message}`);
    }
    throw error;
  }
}

/** A unix time in seconds as the calendar date it falls on in UTC, the provider's due dates. */
export const utcDateOf = (seconds: number | null | undefined) => (seconds ? new Date(seconds * 1000).toISOString().slice(0, 10) : null);
