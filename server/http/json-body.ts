import express, { type RequestHandler, type Router } from "express";
import { AppError } from "./app-error";
import type { RouteSpec } from "./route-table";

/** Deeper than any body Kerf takes (the deepest is about six levels) and far below what costs anything. */
export const MAX_JSON_DEPTH = 32;
/** More entries than any list or object Kerf takes (the longest is 100 part numbers). */
export const MAX_JSON_ITEMS = 1000;
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
const COMMA = 0x2c;

export interface JsonShape {
  /** The deepest nesting of arrays and objects. */
  depth: number;
  /** The most entries in any one array or object. */
  items: number;
}

/**
 * The shape of a UTF-8 JSON text, read byte by byte without parsing: brackets and commas inside
 * strings don't count, and UTF-8 never puts these ASCII bytes inside a multi-byte character. Stops
 * as soon as either figure passes its limit, so a hostile body costs one short loop. (A malformed
 * text may be measured wrong; JSON.parse refuses it next.)
 */
export function jsonShape(bytes: Uint8Array, limits: JsonShape = { depth: Number.POSITIVE_INFINITY, items: Number.POSITIVE_INFINITY }): JsonShape {
  const shape: JsonShape = { depth: 0, items: 0 };
  /** Entries seen so far in each open container, counted by its commas (+1 once it has any). */
  const commas: number[] = [];
  const filled: boolean[] = [];
  let inString = false;
  const entry = () => {
    const level = commas.length - 1;
    if (level >= 0 && !filled[level]) {
      filled[level] = true;
      shape.items = Math.max(shape.items, commas[level]! + 1);
    }
  };
  for (let i = 0; i < bytes.length; i++) {
    const byte = bytes[i];
    if (inString) {
      if (byte === BACKSLASH) i++;
      else if (byte === QUOTE) inString = false;
      continue;
    }
    if (byte === 0x20 || byte === 0x0a || byte === 0x0d || byte === 0x09) continue;
    if (byte === CLOSE_ARRAY || byte === CLOSE_OBJECT) {
      commas.pop();
      filled.pop();
      continue;
    }
    if (byte === COMMA) {
      const level = commas.length - 1;
      if (level >= 0) {
        commas[level]!++;
        filled[level] = false;
      }
      continue;
    }
    entry();
    if (shape.items > limits.items) return shape;
    if (byte === QUOTE) {
      inString = true;
    } else if (byte === OPEN_ARRAY || byte === OPEN_OBJECT) {
      commas.push(0);
      filled.push(false);
      shape.depth = Math.max(shape.depth, commas.length);
      if (shape.depth > limits.depth) return shape;
    }
  }
  return shape;
}

/** Runs on the raw bytes before JSON.parse, so nothing ever walks a body that is too deep or too long. */
function refuseBeforeParsing(_req: unknown, _res: unknown, bytes: Buffer, encoding: string): void {
  // RFC 8259 §8.1: JSON exchanged between systems MUST be UTF-8 (and the shape is read as UTF-8).
  if (encoding !== "utf-8") throw new AppError("unsupported_media_type", "Send JSON encoded as UTF-8.");
  const shape = jsonShape(bytes, { depth: MAX_JSON_DEPTH, items: MAX_JSON_ITEMS });
  if (shape.depth > MAX_JSON_DEPTH) {
    throw new AppError("validation_failed", `The request body is nested too deeply (more than ${MAX_JSON_DEPTH} levels).`);
  }
  if (shape.items > MAX_JSON_ITEMS) {
    throw new AppError("validation_failed", `A list in the request body is too long (more than ${MAX_JSON_ITEMS.toLocaleString("en")} entries).`);
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
