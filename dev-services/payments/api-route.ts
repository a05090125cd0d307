import type { Request, RequestHandler, Response } from "express";
import { ApiError } from "./api-error";
import type { Handler, RequestContext } from "./context";
import type { NewEvent } from "./events";
import { applyExpand, checkExpandable } from "./expand";
import { newId, unixNow } from "./ids";
import { Params } from "./params";
import type { AccountState } from "./records";
import type { Store } from "./store";

/**
 * What every API call goes through: the secret key (Bearer, or Basic as `curl -u key:` sends it),
 * the parameters, the Idempotency-Key, the handler, `expand[]`, and the answer in the provider's
 * JSON with a Request-Id header.
 *
 * Idempotency as the provider documents it (docs.stripe.com/api/idempotent_requests): the first
 * answer to a POST with a key is saved, errors included, and a retry with the same key and the
 * same parameters gets that answer again (header Idempotent-Replayed: true); the same key with
 * other parameters, or on another endpoint, is refused with an idempotency_error. Answers to
 * requests whose parameters failed validation are not saved. Keys are kept for 24 hours.
 */
export interface ApiDeps {
  store: Store;
  baseUrl(): string;
  emit(account: AccountState, event: NewEvent): void;
}

const MAX_IDEMPOTENCY_KEY = 255;

export function apiRoute(deps: ApiDeps, handler: Handler): RequestHandler {
  return (req, res) => {
    const requestId = newId("req");
    res.setHeader("Request-Id", requestId);
    try {
      const account = authenticate(deps.store, req);
      const idempotencyKey = req.method === "POST" ? (req.get("Idempotency-Key") ?? null) : null;
      const raw = paramsOf(req);
      if (idempotencyKey !== null) {
        res.setHeader("Idempotency-Key", idempotencyKey);
        const saved = savedAnswer(account, idempotencyKey, fingerprint(req, raw));
        if (saved) {
          res.setHeader("Idempotent-Replayed", "true");
          return sendJson(res, saved.status, saved.body);
        }
      }
      const context = contextFor(deps, account, req, raw, { id: requestId, idempotencyKey, apiVersion: req.get("Stripe-Version") ?? null });
      const answer = run(handler, context);
      if (idempotencyKey !== null && answer.saved) {
        account.idempotency[idempotencyKey] = { fingerprint: fingerprint(req, raw), status: answer.status, body: answer.body, requestId, created: unixNow() };
      }
      if (req.method !== "GET") deps.store.save();
      sendJson(res, answer.status, answer.body);
    } catch (error) {
      if (!(error instanceof ApiError)) throw error;
      sendJson(res, error.status, error.body());
    }
  };
}

/** The stand-in's own test controls: the same key check and error shape, and handlers that may wait. */
export function controlRoute(store: Store, handler: (account: AccountState, req: Request) => Promise<unknown> | unknown): RequestHandler {
  return async (req, res) => {
    try {
      const body = await handler(authenticate(store, req), req);
      store.save();
      sendJson(res, 200, body);
    } catch (error) {
      if (!(error instanceof ApiError)) throw error;
      sendJson(res, error.status, error.body());
    }
  };
}

export function sendJson(res: Response, status: number, body: unknown): void {
  res.status(status).type("application/json").send(JSON.stringify(body, null, 2));
}

export function paramsOf(req: Request): Record<string, unknown> {
  const source = req.method === "POST" ? req.body : req.query;
  return source && typeof source === "object" ? (source as Record<string, unknown>) : {};
}

function authenticate(store: Store, req: Request): AccountState {
  const key = secretKeyOf(req.get("Authorization"));
  if (!key) {
    throw new ApiError(
      401,
      "You did not provide an API key. You need to provide your API key in the Authorization header, using Bearer auth (e.g. 'Authorization: Bearer YOUR_SECRET_KEY').",
    );
  }
  const account = store.accountForKey(key);
  if (!account) throw new ApiError(401, `Invalid API Key provided: ${maskKey(key)}`);
  return account;
}

function secretKeyOf(header: string | undefined): string | null {
  if (!header) return null;
  const [scheme, value = ""] = header.split(" ", 2);
  if (scheme?.toLowerCase() === "bearer") return value.trim() || null;
  if (scheme?.toLowerCase() === "basic") return Buffer.from(value, "base64").toString("utf8").split(":")[0] || null;
  return null;
}

const maskKey = (key: string) => (key.length <= 12 ? "*".repeat(key.length) : `${key.slice(0, 8)}${"*".repeat(key.length - 12)}${key.slice(-4)}`);

function savedAnswer(account: AccountState, key: string, print: string) {
  if (key.length > MAX_IDEMPOTENCY_KEY) {
    throw new ApiError(400, `Idempotency keys can be at most ${MAX_IDEMPOTENCY_KEY} characters long.`, { type: "idempotency_error" });
  }
  const saved = account.idempotency[key];
  if (saved && saved.fingerprint !== print) {
    throw new ApiError(
      400,
      `Keys for idempotent requests can only be used with the same parameters they were first used with. Try using a key other than '${key}' if you meant to execute a different request.`,
      { type: "idempotency_error" },
    );
  }
  return saved;
}

/** The endpoint and its parameters, with object keys in a fixed order. */
function fingerprint(req: Request, raw: Record<string, unknown>): string {
  const canonical = (value: unknown): unknown =>
    value && typeof value === "object" && !Array.isArray(value)
      ? Object.fromEntries(Object.entries(value).sort(([a], [b]) => a.localeCompare(b)).map(([key, entry]) => [key, canonical(entry)]))
      : Array.isArray(value)
        ? value.map(canonical)
        : value;
  return JSON.stringify([req.method, req.path, canonical(raw)]);
}

function contextFor(deps: ApiDeps, account: AccountState, req: Request, raw: Record<string, unknown>, request: RequestContext["request"]): RequestContext {
  return {
    account,
    store: deps.store,
    params: new Params(raw),
    id: typeof req.params.id === "string" ? req.params.id : "",
    baseUrl: deps.baseUrl(),
    request,
    emit: (type, object, previousAttributes) => deps.emit(account, { type, object, previousAttributes, request }),
  };
}

function run(handler: Handler, context: RequestContext): { status: number; body: unknown; saved: boolean } {
  try {
    checkExpandable(context.params.expand());
    const body = handler(context);
    return { status: 200, body: applyExpand(body, context.params.expand(), context.account, context.baseUrl), saved: true };
  } catch (error) {
    if (!(error instanceof ApiError)) throw error;
    return { status: error.status, body: error.body(), saved: error.savedForIdempotency };
  }
}
