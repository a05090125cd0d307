import http from "node:http";
import https from "node:https";
import { eventBody } from "./events";
import { newId } from "./ids";
import type { AccountState, DeliveryAttempt, DeliveryKind, DeliveryRecord, EventRecord, WebhookEndpointRecord } from "./records";
import { signatureHeader } from "./signature";
import type { Store } from "./store";

/**
 * Sends each event to the account's webhook endpoints, signed (signature.ts). An answer other than
 * 2xx, a redirect, a refused connection or a timeout is a failed attempt, tried again after a
 * growing delay (first, 2×first, 4×first, … up to maxDelay) until maxAttempts, as the provider
 * retries with exponential backoff (for up to three days; locally in minutes). Unfinished deliveries
 * survive a restart. For tests: deliveries can be held and released in another order, an event
 * resent freshly signed, or its first request replayed byte for byte with its old signature.
 */
export interface RetryPolicy {
  firstDelayMs: number;
  maxDelayMs: number;
  maxAttempts: number;
  /** How long an endpoint may take to answer (Kerf's choice for local use). */
  timeoutMs: number;
}

export const DEMO_RETRY: RetryPolicy = { firstDelayMs: 2_000, maxDelayMs: 60_000, maxAttempts: 30, timeoutMs: 10_000 };
/** Fast enough that a test sees a restarted app receive the event within seconds; about a minute in all. */
export const TEST_RETRY: RetryPolicy = { firstDelayMs: 200, maxDelayMs: 2_000, maxAttempts: 40, timeoutMs: 5_000 };

export type ReleaseOrder = "created" | "reverse";

interface Sent extends DeliveryAttempt {
  header: string;
}

const listens = (endpoint: WebhookEndpointRecord, type: string) =>
  endpoint.status === "enabled" && (endpoint.enabledEvents.includes("*") || endpoint.enabledEvents.includes(type));

export class WebhookSender {
  private readonly timers = new Map<string, NodeJS.Timeout>();
  private readonly inFlight = new Set<Promise<unknown>>();
  private readonly requests = new Set<http.ClientRequest>();
  private stopped = false;

  constructor(
    private readonly store: Store,
    private readonly policy: RetryPolicy,
  ) {}

  enqueue(account: AccountState, event: EventRecord): void {
    const endpoints = Object.values(account.webhookEndpoints).filter((endpoint) => listens(endpoint, event.type));
    event.pendingAtCreation = endpoints.length;
    for (const endpoint of endpoints) {
      const delivery = this.newDelivery(account, event, endpoint, "automatic");
      delivery.state = account.holdDeliveries ? "held" : "pending";
      if (delivery.state === "pending") this.schedule(account, delivery, 0);
    }
  }

  /** After a restart: every unfinished delivery is tried again when it is due. */
  resume(): void {
    for (const account of this.store.accounts) {
      for (const delivery of Object.values(account.deliveries)) {
        if (delivery.state === "pending") this.schedule(account, delivery, Math.max(0, delivery.nextAttemptAt - Date.now()));
      }
    }
  }

  deliveriesOf(account: AccountState, eventId: string): DeliveryRecord[] {
    return Object.values(account.deliveries).filter((delivery) => delivery.eventId === eventId);
  }

  /** One more delivery of an old event to each endpoint that listens (or the one named), freshly signed. */
  async resend(account: AccountState, event: EventRecord, endpointId?: string): Promise<DeliveryRecord[]> {
    const endpoints = Object.values(account.webhookEndpoints).filter((endpoint) => (endpointId ? endpoint.id === endpointId : listens(endpoint, event.type)));
    return Promise.all(endpoints.map((endpoint) => this.deliverOnce(account, event, endpoint, "resend", signatureHeader(eventBody(event), account.webhookSecret))));
  }

  /** The event's first request to each endpoint sent again as it was captured: same bytes, same (now old) signature. */
  async replay(account: AccountState, event: EventRecord): Promise<DeliveryRecord[]> {
    const captured = this.deliveriesOf(account, event.id).filter((delivery) => delivery.kind === "automatic" && delivery.firstSignature);
    return Promise.all(
      captured.map((delivery) => this.deliverOnce(account, event, account.webhookEndpoints[delivery.endpointId]!, "replay", delivery.firstSignature!)),
    );
  }

  hold(account: AccountState): void {
    account.holdDeliveries = true;
    this.store.save();
  }

  /** Sends every held delivery, one after another, oldest event first or (reverse) newest first. */
  async release(account: AccountState, order: ReleaseOrder): Promise<DeliveryRecord[]> {
    account.holdDeliveries = false;
    const seqOf = (delivery: DeliveryRecord) => account.events[delivery.eventId]?.seq ?? 0;
    const held = Object.values(account.deliveries)
      .filter((delivery) => delivery.state === "held")
      .sort((a, b) => (order === "created" ? seqOf(a) - seqOf(b) : seqOf(b) - seqOf(a)));
    for (const delivery of held) {
      delivery.state = "pending";
      await this.attempt(account, delivery);
    }
    this.store.save();
    return held;
  }

  async stop(): Promise<void> {
    this.stopped = true;
    for (const timer of this.timers.values()) clearTimeout(timer);
    this.timers.clear();
    for (const request of this.requests) request.destroy(new Error("the stand-in is stopping"));
    await Promise.allSettled([...this.inFlight]);
  }

  private newDelivery(account: AccountState, event: EventRecord, endpoint: WebhookEndpointRecord, kind: DeliveryKind): DeliveryRecord {
    const delivery: DeliveryRecord = {
      id: newId("whdel"),
      eventId: event.id,
      endpointId: endpoint.id,
      kind,
      state: "pending",
      attempts: [],
      nextAttemptAt: Date.now(),
      firstSignature: null,
    };
    account.deliveries[delivery.id] = delivery;
    return delivery;
  }

  private schedule(account: AccountState, delivery: DeliveryRecord, delayMs: number): void {
    if (this.stopped) return;
    clearTimeout(this.timers.get(delivery.id));
    delivery.nextAttemptAt = Date.now() + delayMs;
    const timer = setTimeout(() => {
      this.timers.delete(delivery.id);
      void this.attempt(account, delivery);
    }, delayMs);
    this.timers.set(delivery.id, timer);
  }

  private async attempt(account: AccountState, delivery: DeliveryRecord): Promise<void> {
    const event = account.events[delivery.eventId];
    const endpoint = account.webhookEndpoints[delivery.endpointId];
    if (!event || !endpoint || endpoint.status !== "enabled") {
      delivery.state = "failed";
      this.store.save();
      return;
    }
    const body = eventBody(event);
    const sent = await this.post(endpoint.url, body, signatureHeader(body, account.webhookSecret), "automatic");
    // Stopped mid-request: the attempt doesn't count; the delivery is resumed after a restart.
    if (this.stopped) return;
    delivery.firstSignature ??= sent.header;
    delivery.attempts.push(attemptRecord(sent));
    if (isSuccess(sent)) delivery.state = "delivered";
    else if (delivery.attempts.length >= this.policy.maxAttempts) delivery.state = "failed";
    else this.schedule(account, delivery, this.backoff(delivery.attempts.length));
    this.store.save();
  }

  private async deliverOnce(account: AccountState, event: EventRecord, endpoint: WebhookEndpointRecord, kind: DeliveryKind, header: string) {
    const delivery = this.newDelivery(account, event, endpoint, kind);
    const sent = await this.post(endpoint.url, eventBody(event), header, kind);
    delivery.firstSignature = sent.header;
    delivery.attempts.push(attemptRecord(sent));
    delivery.state = isSuccess(sent) ? "delivered" : "failed";
    this.store.save();
    return delivery;
  }

  private backoff(failedAttempts: number): number {
    return Math.min(this.policy.firstDelayMs * 2 ** (failedAttempts - 1), this.policy.maxDelayMs);
  }

  /** Node's own client without keep-alive: each attempt is a fresh connection, as a restarted app sees it. */
  private post(url: string, body: string, header: string, kind: DeliveryKind): Promise<Sent> {
    const signedAt = Number(/^t=(\d+)/.exec(header)?.[1]);
    const base = { kind, at: Date.now(), signedAt, header };
    const sending = new Promise<Sent>((resolve) => {
      const client = url.startsWith("https:") ? https : http;
      const request = client.request(url, {
        method: "POST",
        agent: false,
        timeout: this.policy.timeoutMs,
        headers: {
          "content-type": "application/json; charset=utf-8",
          "content-length": Buffer.byteLength(body),
          "stripe-signature": header,
          "user-agent": "Kerf-payments-stand-in/1.0",
        },
      });
      this.requests.add(request);
      request.on("response", (response) => {
        response.resume();
        response.on("end", () => resolve({ ...base, status: response.statusCode ?? null, error: null }));
        response.on("error", (error) => resolve({ ...base, status: response.statusCode ?? null, error: error.message }));
      });
      request.on("timeout", () => request.destroy(new Error(`no answer within ${this.policy.timeoutMs} ms`)));
      request.on("error", (error) => resolve({ ...base, status: null, error: error.message }));
      request.on("close", () => this.requests.delete(request));
      request.end(body);
    });
    this.inFlight.add(sending);
    void sending.finally(() => this.inFlight.delete(sending));
    return sending;
  }
}

// Redirects count as failures, as they do at the provider.
const isSuccess = (sent: Sent) => sent.status !== null && sent.status >= 200 && sent.status < 300;

function attemptRecord({ kind, at, signedAt, status, error }: Sent): DeliveryAttempt {
  return { kind, at, signedAt, status, error };
}
