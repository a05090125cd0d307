import { createHmac } from "node:crypto";
import { unixNow } from "./ids";

/**
 * The webhook signature as the provider documents it (docs.stripe.com/webhooks, "Verify webhook
 * signatures manually"): `Stripe-Signature: t=<unix seconds>,v1=<hex HMAC-SHA256>` computed with
 * the endpoint's signing secret over "<t>.<raw body>". The SDK's webhooks.constructEvent checks
 * exactly this, and refuses a `t` older than its tolerance (300 s by default).
 */
export function signatureHeader(body: string, secret: string, signedAt = unixNow()): string {
  const v1 = createHmac("sha256", secret).update(`${signedAt}.${body}`, "utf8").digest("hex");
  return `t=${signedAt},v1=${v1}`;
}
