import Stripe from "stripe";

/**
 * The error a call was refused with (and a failure if it wasn't refused). `message` is the
 * provider's message as sent; the SDK's own error message puts the request id in front of it.
 */
export async function refusal(call: Promise<unknown>) {
  const outcome = await call.then(
    () => new Error("expected the stand-in to refuse this call"),
    (error: unknown) => error,
  );
  if (!(outcome instanceof Stripe.errors.StripeError)) throw outcome;
  const raw = outcome.raw as { message?: string; type?: string };
  return { error: outcome, status: outcome.statusCode, type: raw.type, code: outcome.code, param: outcome.param, message: raw.message };
}
