import express, { type RequestHandler, type Router } from "express";
import { AppError } from "./app-error";
import type { RouteSpec } from "./route-table";

/** Deeper than any body Kerf takes (the deepest is about six levels) and far below what costs anything. */
export const MAX_JSON_DEPTH = 32;
/** Bodies of routes anyone may call (sign-in, sign-up, invitations, review decisions): small forms. */
export const PUBLIC_BODY_LIMIT = 16 * 1024;
/** Bodies of signed-in routes, unless a route states its own limit. */
export const DEFAULT_BODY_LIMIT = 100 * 1024;

const QUOTE = 0x22;
const BACKSLASH = 0x5c;
const OPEN_ARRAY = 0x5b;
const CLOSE_ARRAY = 0x5d;
const OPEN_OBJECT = 0x7b;
const CLOSE_OBJECT = 0x7d;

/**
 * The deepest nesting of arrays and objects in a UTF-8 JSON text, read byte by byte without parsing
 * (brackets inside strings don't count; UTF-8 never puts these ASCII bytes inside a multi-byte
 * character). Stops as soon as the depth passes `stopAbove`, so a hostile body costs one short loop.
 */
export function jsonDepth(bytes: Uint8Array, stopAbove = Number.POSITIVE_INFINITY): number {
  let depth = 0;
  let deepest = 0;
  let inString = false;
  for (let i = 0; i < bytes.length; i++) {
    const byte = bytes[i];
    if (inString) {
      if (byte === BACKSLASH) i++;
      else if (byte === QUOTE) inString = false;
    } else if (byte === QUOTE) {
      inString = true;
    } else if (byte === OPEN_ARRAY || byte === OPEN_OBJECT) {
      depth++;
      if (depth > deepest) deepest = depth;
      if (deepest > stopAbove) return deepest;
    } else if (byte === CLOSE_ARRAY || byte === CLOSE_OBJECT) {
      depth--;
    }
  }
  return deepest;
}

/** Runs on the raw bytes before JSON.parse, so nothing ever walks a body that is too deep. */
function refuseBeforeParsing(_req: unknown, _res: unknown, bytes: Buffer, encoding: string): void {
  // RFC 8259 §8.1: JSON exchanged between systems MUST be UTF-8 (and the depth count reads UTF-8).
  if (encoding !== "utf-8") throw new AppError("unsupported_media_type", "Send JSON encoded as UTF-8.");
  if (jsonDepth(bytes, MAX_JSON_DEPTH) > MAX_JSON_DEPTH) {
    throw new AppError("validation_failed", `The request body is nested too deeply (more than ${MAX_JSON_DEPTH} levels).`);
  }
}

export function bodyLimitOf(spec: Pick<RouteSpec, "access" | "bodyLimit">): number {
  return spec.bodyLimit ?? (spec.access.kind === "public" ? PUBLIC_BODY_LIMIT : DEFAULT_BODY_LIMIT);
}

const readsJson = (spec: RouteSpec) => spec.method !== "get" && (spec.body ?? "json") === "json";

/** The JSON body reader of one route: its own size limit, the depth cap, UTF-8 only. */
export function jsonBodyFor(spec: RouteSpec): RequestHandler {
  return express.json({ limit: bodyLimitOf(spec), strict: true, verify: refuseBeforeParsing });
}

/**
 * Reads the body of every route that takes JSON, each with its own limit. Mounted before sessions are
 * loaded, so a body that is too deep, too big or not JSON is refused before any database work.
 */
export function bodyReaders(routes: RouteSpec[]): Router {
  const router = express.Router();
  for (const spec of routes.filter(readsJson)) router[spec.method](spec.path, jsonBodyFor(spec));
  return router;
}
