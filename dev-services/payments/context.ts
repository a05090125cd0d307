import type { Params } from "./params";
import type { AccountState } from "./records";
import type { Store } from "./store";

/** What an API handler gets: the caller's account, its parameters, and a way to record events. */
export interface RequestContext {
  account: AccountState;
  store: Store;
  params: Params;
  /** The `:id` of the route, when it has one. */
  id: string;
  baseUrl: string;
  request: { id: string | null; idempotencyKey: string | null; apiVersion: string | null };
  /** Records an event (and queues its webhook deliveries) for a change the handler made. */
  emit(type: string, object: Record<string, unknown>, previousAttributes?: Record<string, unknown>): void;
}

export type Handler = (context: RequestContext) => unknown;
