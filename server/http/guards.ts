import type { RequestHandler } from "express";
import { roleMay } from "../../shared/access/roles";
import type { Database } from "../db/client";
import { findMembership } from "../channels/channels.repository";
import { AppError } from "./app-error";
import type { RouteSpec } from "./route-table";
import { parseId } from "./validate";

const writeMethods = new Set(["POST", "PUT", "PATCH", "DELETE"]);

function hasBody(req: Parameters<RequestHandler>[0]): boolean {
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

function authorise(spec: RouteSpec, db: Database): RequestHandler {
  const access = spec.access;
  return async (req, _res, next) => {
    if (access.kind === "public") return next();
    if (!req.user) throw new AppError("unauthenticated", "Sign in to continue.");
    if (access.kind === "account") return next();
    const channelId = parseId(req.params.channelId, "Channel");
    const membership = await findMembership(db, channelId, req.user.id);
    if (!membership) throw new AppError("not_found", "Channel not found.");
    if (!roleMay(membership.role, access.area, access.need)) {
      throw new AppError("forbidden", "Your role in this channel does not allow that.");
    }
    req.member = { userId: req.user.id, channelId, role: membership.role };
    next();
  };
}

export function guardsFor(db: Database) {
  return (spec: RouteSpec): RequestHandler[] => [bodyKind(spec), authorise(spec, db)];
}

/** The member context a channel route's handler can rely on (set by `authorise`). */
export function memberOf(req: Parameters<RequestHandler>[0]) {
  if (!req.member) throw new AppError("internal", "Route is missing channel access.");
  return req.member;
}

export function signedInUser(req: Parameters<RequestHandler>[0]) {
  if (!req.user) throw new AppError("unauthenticated", "Sign in to continue.");
  return req.user;
}
