import Stripe from "stripe";
import { testEnv } from "./test-env";

/**
 * Reaching the payments stand-in from tests: the provider's own SDK pointed at it, an account of
 * the test's own (its customers, invoices, events and webhook endpoints are nobody else's), and the
 * stand-in's test controls (dev-services/payments/controls.ts).
 */
export interface PaymentsAccount {
  apiUrl: string;
  secretKey: string;
  webhookSecret: string;
  stripe: Stripe;
  controls: StandInControls;
}

export function stripeClient(apiUrl: string, secretKey: string): Stripe {
  const url = new URL(apiUrl);
  return new Stripe(secretKey, { host: url.hostname, port: Number(url.port), protocol: url.protocol === "https:" ? "https" : "http" });
}

export async function createPaymentsAccount(apiUrl = testEnv.payments.apiUrl, callerKey = testEnv.payments.secretKey): Promise<PaymentsAccount> {
  const created = (await control(apiUrl, callerKey, "POST", "/_standin/accounts")) as { secret_key: string; webhook_secret: string };
  return { apiUrl, secretKey: created.secret_key, webhookSecret: created.webhook_secret, stripe: stripeClient(apiUrl, created.secret_key), controls: standInControls(apiUrl, created.secret_key) };
}

export interface DeliveryView {
  id: string;
  event: string;
  type: string | null;
  endpoint: string;
  url: string | null;
  kind: "automatic" | "resend" | "replay";
  state: "pending" | "held" | "delivered" | "failed";
  attempts: { sent_at_ms: number; signed_at: number; status: number | null; error: string | null }[];
}

export type StandInControls = ReturnType<typeof standInControls>;

export function standInControls(apiUrl: string, secretKey: string) {
  const list = async (method: "GET" | "POST", path: string, body?: Record<string, string>) =>
    ((await control(apiUrl, secretKey, method, path, body)) as { data: DeliveryView[] }).data;
  return {
    deliveries: (eventId: string) => list("GET", `/_standin/events/${eventId}/deliveries`),
    resend: (eventId: string, endpoint?: string) => list("POST", `/_standin/events/${eventId}/resend`, endpoint ? { endpoint } : undefined),
    replay: (eventId: string) => list("POST", `/_standin/events/${eventId}/replay`),
    hold: () => control(apiUrl, secretKey, "POST", "/_standin/webhooks/hold"),
    release: (order: "created" | "reverse" = "created") => list("POST", "/_standin/webhooks/release", { order }),
  };
}

async function control(apiUrl: string, secretKey: string, method: "GET" | "POST", path: string, body?: Record<string, string>): Promise<unknown> {
  const response = await fetch(`${apiUrl}${path}`, {
    method,
    headers: { authorization: `Bearer ${secretKey}`, ...(body ? { "content-type": "application/x-www-form-urlencoded" } : {}) },
    body: body ? new URLSearchParams(body) : undefined,
  });
  const answer = (await response.json()) as unknown;
  if (!response.ok) throw new Error(`the payments stand-in refused ${method} ${path}: ${JSON.stringify(answer)}`);
  return answer;
}
