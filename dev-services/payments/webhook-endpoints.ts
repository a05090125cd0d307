import { invalidParam, missingParam, noSuch } from "./api-error";
import type { RequestContext } from "./context";
import { newId, unixNow } from "./ids";
import { listPage, PAGING_PARAMS } from "./lists";
import type { Params } from "./params";
import type { AccountState, WebhookEndpointRecord } from "./records";
import { webhookEndpointView } from "./views";

/**
 * /v1/webhook_endpoints: where the account's events are sent. The provider makes a signing secret
 * per endpoint and shows it once, on creation; the stand-in signs every endpoint of an account with
 * the account's one secret (PAYMENTS_WEBHOOK_SECRET), so the app's single setting fits every
 * endpoint a test adds. Creation still answers with `secret`, as the provider does.
 */
const EVENT_TYPE = /^(\*|[a-z_]+(\.[a-z_]+)+)$/;

function findEndpoint(account: AccountState, id: string): WebhookEndpointRecord {
  const endpoint = account.webhookEndpoints[id];
  if (!endpoint) throw noSuch("webhook endpoint", id);
  return endpoint;
}

function urlParam(params: Params): string | undefined {
  const url = params.string("url");
  if (url !== undefined && !/^https?:\/\//.test(url)) throw invalidParam("url", `Invalid URL: ${url}. URLs must begin with http:// or https://.`);
  return url;
}

function enabledEventsParam(params: Params): string[] | undefined {
  const events = params.stringList("enabled_events");
  const wrong = events?.find((type) => !EVENT_TYPE.test(type));
  if (wrong !== undefined) throw invalidParam("enabled_events", `Invalid event type: ${wrong}`);
  return events;
}

export function addWebhookEndpoint(account: AccountState, seq: number, url: string, enabledEvents: string[], description: string | null = null): WebhookEndpointRecord {
  const endpoint: WebhookEndpointRecord = { id: newId("we"), seq, created: unixNow(), url, enabledEvents, description, metadata: {}, status: "enabled" };
  account.webhookEndpoints[endpoint.id] = endpoint;
  return endpoint;
}

export function createWebhookEndpoint({ account, store, params }: RequestContext) {
  params.only(["url", "enabled_events", "description", "metadata", "api_version"]);
  const url = urlParam(params);
  if (url === undefined) throw missingParam("url");
  const enabledEvents = enabledEventsParam(params);
  if (enabledEvents === undefined) throw missingParam("enabled_events");
  const endpoint = addWebhookEndpoint(account, store.nextSeq(), url, enabledEvents, params.nullableString("description") ?? null);
  endpoint.metadata = params.metadata();
  return { ...webhookEndpointView(endpoint), secret: account.webhookSecret };
}

export function retrieveWebhookEndpoint({ account, params, id }: RequestContext) {
  params.only([]);
  return webhookEndpointView(findEndpoint(account, id));
}

export function updateWebhookEndpoint({ account, params, id }: RequestContext) {
  params.only(["url", "enabled_events", "description", "metadata", "disabled"]);
  const endpoint = findEndpoint(account, id);
  endpoint.url = urlParam(params) ?? endpoint.url;
  endpoint.enabledEvents = enabledEventsParam(params) ?? endpoint.enabledEvents;
  const description = params.nullableString("description");
  if (description !== undefined) endpoint.description = description;
  endpoint.metadata = params.metadata(endpoint.metadata);
  const disabled = params.boolean("disabled");
  if (disabled !== undefined) endpoint.status = disabled ? "disabled" : "enabled";
  return webhookEndpointView(endpoint);
}

export function listWebhookEndpoints({ account, params }: RequestContext) {
  params.only([...PAGING_PARAMS]);
  return listPage(Object.values(account.webhookEndpoints), params, "/v1/webhook_endpoints", webhookEndpointView);
}

export function deleteWebhookEndpoint({ account, params, id }: RequestContext) {
  params.only([]);
  const endpoint = findEndpoint(account, id);
  delete account.webhookEndpoints[endpoint.id];
  return { id: endpoint.id, object: "webhook_endpoint", deleted: true };
}
