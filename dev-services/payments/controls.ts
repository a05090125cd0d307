import type { Request, Router } from "express";
import { invalidParam } from "./api-error";
import { controlRoute, paramsOf } from "./api-route";
import { findEvent } from "./events";
import { Params } from "./params";
import type { AccountState, DeliveryRecord } from "./records";
import type { Store } from "./store";
import type { ReleaseOrder, WebhookSender } from "./webhooks";

/**
 * The stand-in's own controls for tests, under /_standin (no such routes exist at the provider).
 * Each acts on the account whose secret key calls it:
 *   POST /_standin/accounts                 a fresh account of its own: { id, secret_key, webhook_secret }
 *   GET  /_standin/events/:id/deliveries    every delivery of an event and each attempt's answer
 *   POST /_standin/events/:id/resend        send the event again now, freshly signed (endpoint=we_… for one)
 *   POST /_standin/events/:id/replay        send its first request again as captured: same bytes, old signature
 *   POST /_standin/webhooks/hold            keep new deliveries back…
 *   POST /_standin/webhooks/release         …and send them, order=created (oldest first) or reverse
 */
export function mountControls(router: Router, store: Store, sender: WebhookSender): void {
  router.post(
    "/_standin/accounts",
    controlRoute(store, (_caller, req) => {
      const account = store.createAccount({ name: new Params(paramsOf(req)).string("name") ?? "Kerf test channel" });
      return { id: account.id, object: "account", name: account.name, secret_key: account.secretKey, webhook_secret: account.webhookSecret };
    }),
  );
  router.get(
    "/_standin/events/:id/deliveries",
    controlRoute(store, (account, req) => deliveryList(account, sender.deliveriesOf(account, eventOf(account, req).id))),
  );
  router.post(
    "/_standin/events/:id/resend",
    controlRoute(store, async (account, req) => {
      const endpoint = new Params(paramsOf(req)).string("endpoint");
      if (endpoint !== undefined && !account.webhookEndpoints[endpoint]) throw invalidParam("endpoint", `No such webhook endpoint: '${endpoint}'`, "resource_missing");
      return deliveryList(account, await sender.resend(account, eventOf(account, req), endpoint));
    }),
  );
  router.post(
    "/_standin/events/:id/replay",
    controlRoute(store, async (account, req) => deliveryList(account, await sender.replay(account, eventOf(account, req)))),
  );
  router.post(
    "/_standin/webhooks/hold",
    controlRoute(store, (account) => {
      sender.hold(account);
      return { holding: true };
    }),
  );
  router.post(
    "/_standin/webhooks/release",
    controlRoute(store, async (account, req) => {
      const order: ReleaseOrder = new Params(paramsOf(req)).oneOf("order", ["created", "reverse"]) ?? "created";
      return deliveryList(account, await sender.release(account, order));
    }),
  );
}

const eventOf = (account: AccountState, req: Request) => findEvent(account, String(req.params.id));

function deliveryList(account: AccountState, deliveries: DeliveryRecord[]) {
  return {
    object: "list",
    data: deliveries.map((delivery) => ({
      id: delivery.id,
      event: delivery.eventId,
      type: account.events[delivery.eventId]?.type ?? null,
      endpoint: delivery.endpointId,
      url: account.webhookEndpoints[delivery.endpointId]?.url ?? null,
      kind: delivery.kind,
      state: delivery.state,
      attempts: delivery.attempts.map((attempt) => ({ sent_at_ms: attempt.at, signed_at: attempt.signedAt, status: attempt.status, error: attempt.error })),
    })),
  };
}
