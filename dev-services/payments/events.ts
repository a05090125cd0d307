import { noSuch } from "./api-error";
import type { RequestContext } from "./context";
import { newId, unixNow } from "./ids";
import { listPage, PAGING_PARAMS } from "./lists";
import type { AccountState, EventRecord } from "./records";
import type { Store } from "./store";
import { eventView } from "./views";

/**
 * Every change is recorded as an event (customer.created, invoice.finalized, invoice.paid, …),
 * listed at /v1/events newest first and sent to the account's webhook endpoints (webhooks.ts).
 */
export interface NewEvent {
  type: string;
  object: Record<string, unknown>;
  previousAttributes?: Record<string, unknown>;
  request: { id: string | null; idempotencyKey: string | null; apiVersion: string | null };
}

export function recordEvent(store: Store, account: AccountState, input: NewEvent): EventRecord {
  const event: EventRecord = {
    id: newId("evt"),
    seq: store.nextSeq(),
    created: unixNow(),
    type: input.type,
    apiVersion: input.request.apiVersion,
    object: input.object,
    previousAttributes: input.previousAttributes ?? null,
    request: { id: input.request.id, idempotency_key: input.request.idempotencyKey },
    pendingAtCreation: 0,
  };
  account.events[event.id] = event;
  return event;
}

/** Deliveries not yet answered with a 2xx: the event's pending_webhooks. */
export function pendingWebhooks(account: AccountState, eventId: string): number {
  return Object.values(account.deliveries).filter((delivery) => delivery.eventId === eventId && delivery.kind === "automatic" && delivery.state !== "delivered").length;
}

/** The exact bytes every delivery of the event carries (the provider sends its JSON indented). */
export function eventBody(event: EventRecord): string {
  return JSON.stringify(eventView(event, event.pendingAtCreation), null, 2);
}

export function findEvent(account: AccountState, id: string): EventRecord {
  const event = account.events[id];
  if (!event) throw noSuch("event", id);
  return event;
}

export function retrieveEvent({ account, params, id }: RequestContext) {
  params.only([]);
  const event = findEvent(account, id);
  return eventView(event, pendingWebhooks(account, event.id));
}

/** `type` may end in `.*` (`invoice.*`); `types[]` lists several. */
export function listEvents({ account, params }: RequestContext) {
  params.only(["type", "types", ...PAGING_PARAMS]);
  const patterns = [params.string("type"), ...(params.stringList("types") ?? [])].filter((pattern): pattern is string => pattern !== undefined);
  const matches = (type: string) => patterns.length === 0 || patterns.some((pattern) => (pattern.endsWith(".*") ? type.startsWith(pattern.slice(0, -1)) : type === pattern));
  const events = Object.values(account.events).filter((event) => matches(event.type));
  return listPage(events, params, "/v1/events", (event) => eventView(event, pendingWebhooks(account, event.id)));
}
