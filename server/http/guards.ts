import type { Request, RequestHandler } from "express";
import { roleMay } from "../../shared/access/roles";
import { isUuid } from "../../shared/http/ids";
import { channelChildren, channelScope, isChildParam, type ChildParam } from "../db/channel-scope";
import type { Database } from "../db/client";
import { AppError, notFound } from "./app-error";
import type { Caller, RouteSpec } from "./route-table";
import { rolesReadWithSession } from "./session";
import { parseId } from "./validate";

const writeMethods = new Set(["POST", "PUT", "PATCH", "DELETE"]);

function hasBody(req: Request): boolean {
  const length = Number(req.get("content-length") ?? 0);
  return length > 0 || req.get("transfer-encoding") !== undefined;
}

function bodyKind(spec: RouteSpec): RequestHandler {
  const kind = spec.body ?? "json";
  return (req, _res, next) => {
    if (!writeMethods.has(req.method) || !hasBody(req) || kind === "none") return next();
    const accepted = kind === "json" ? req.is("application/json") : req.is("multipart/form-data");
    if (!accepted) {
      const wanted = kind === "json" ? "application/json" : "multipart/form-data";
      return next(new AppError("unsupported_media_type", `Send the body as ${wanted}.`));
    }
    next();
  };
}

/** The rows a channel route's path names, in path order; a path naming anything else is a mistake found at start. */
export function childParamsOf(spec: RouteSpec): ChildParam[] {
  const names = [...spec.path.matchAll(/:(\w+)/g)].map((match) => match[1]!).filter((name) => name !== "channelId" && !spec.valueParams?.includes(name));
  for (const name of names) {
    if (!isChildParam(name)) {
      throw new Error(`${spec.method.toUpperCase()} ${spec.path}: :${name} is neither a row of the channel (server/db/channel-scope.ts) nor one of the route's valueParams.`);
    }
  }
  return names as ChildParam[];
}

/**
 * Signed out 401; not a member of the route's channel 404; a role without the grant 403; a row the
 * path names that isn't the channel's (or a malformed id) 404 — all from one query.
 */
function authorise(spec: RouteSpec, db: Database): RequestHandler {
  const access = spec.access;
  const children = access.kind === "channel" ? childParamsOf(spec) : [];
  return async (req, _res, next) => {
    if (access.kind === "public") return next();
    if (!req.user) throw new AppError("unauthenticated", "Sign in to continue.");
    if (access.kind === "account") return next();
    const channelId = parseId(req.params.channelId, "Channel");
    const named = children.map((param) => ({ param, id: String(req.params[param] ?? "").toLowerCase() }));
    const wellFormed = named.filter((row) => isUuid(row.id));
    const roles = rolesReadWithSession(req);
    // With no rows to look for, the role read with the session (this request) is the whole answer.
    const scope = wellFormed.length === 0 && roles ? { role: roles[channelId] ?? null, missing: [] } : await channelScope(db, channelId, req.user.id, wellFormed);
    if (!scope.role) throw new AppError("not_found", "Channel not found.");
    if (!roleMay(scope.role, access.area, access.need)) {
      throw new AppError("forbidden", access.refusal ?? "Your role in this channel does not allow that.");
    }
    const absent = named.find((row) => !isUuid(row.id) || scope.missing.includes(row.param));
    if (absent) throw notFound(channelChildren[absent.param].what);
    const { id: userId, name, email, emailVerified, timeZone } = req.user;
    req.channelScope = { caller: { userId, name, email, emailVerified, timeZone, channelId, role: scope.role }, ids: Object.fromEntries(named.map((row) => [row.param, row.id])) };
    next();
  };
}

export function guardsFor(db: Database) {
  return (spec: RouteSpec): RequestHandler[] => [bodyKind(spec), authorise(spec, db)];
}

function scopeOf(req: Request) {
  if (!req.channelScope) throw new AppError("internal", "Route is missing channel access.");
  return req.channelScope;
}

/** Who is calling a channel route (set by its guard). */
export function callerOf(req: Request): Caller {
  return scopeOf(req).caller;
}

/** An id from the route's path, already checked to be a row of the caller's channel. */
export function idOf(req: Request, param: ChildParam): string {
  const id = scopeOf(req).ids[param];
  if (id === undefined) throw new AppError("internal", `Route has no :${param}.`);
  return id;
}

export function signedInUser(req: Request) {
  if (!req.user) throw new AppError("unauthenticated", "Sign in to continue.");
  return req.user;
}
