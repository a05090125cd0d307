import type { NextFunction, Request, RequestHandler, Response, Router } from "express";
import type { Area, Need, Role } from "../../shared/access/roles";
import type { ChildParam } from "../db/channel-scope";

/**
 * Who may call a route, stated beside it:
 * - public: anyone, signed in or not;
 * - account: any signed-in person;
 * - channel: a member of the route's :channelId whose role has `need` on `area`
 *   (the spec's role table, shared/access/roles.ts). A non-member gets 404, as if the channel did not exist.
 */
export type Access = { kind: "public" } | { kind: "account" } | { kind: "channel"; area: Area; need: Need; refusal?: string };

export const publicAccess: Access = { kind: "public" };
export const anyAccount: Access = { kind: "account" };
/** `refusal` is the 403's message where a plainer one than "your role does not allow that" helps. */
export const channelAccess = (area: Area, need: Need, refusal?: string): Access => ({ kind: "channel", area, need, refusal });

export type Method = "get" | "post" | "put" | "patch" | "delete";

export type Handler = (req: Request, res: Response, next: NextFunction) => Promise<unknown> | unknown;

export interface RouteSpec {
  method: Method;
  /** Full path, starting with /api. */
  path: string;
  access: Access;
  /** Body kind a write route takes; JSON unless it says otherwise. */
  body?: "json" | "multipart" | "none";
  /** Largest JSON body in bytes; by default 16 kB for public routes and 100 kB for the rest (server/http/json-body.ts). */
  bodyLimit?: number;
  /**
   * Path parameters of a channel route that are values, not rows (a part number, a stage): the guard
   * checks every other `:param` as a row of the route's channel (server/db/channel-scope.ts).
   */
  valueParams?: string[];
  /**
   * Answered even while the session store (the database) is down: the session is read when it can be
   * and the caller treated as signed out when it can't (health checks).
   */
  sessionOptional?: true;
  /**
   * Called by another service, which proves itself by signing the raw body (the payments provider's
   * webhook): mounted before sessions and CSRF, public, with the body left unread for the handler.
   */
  signedByCaller?: true;
  /** Extra middleware that runs after authorisation (e.g. rate limits). */
  before?: RequestHandler[];
  handler: Handler;
}

/** Who is calling a channel route: the signed-in person and their role in the route's channel. */
export interface Caller {
  userId: string;
  name: string;
  email: string;
  /** Whether they have confirmed that address: until then Kerf mails nobody else for them (server/mail/senders.ts). */
  emailVerified: boolean;
  timeZone: string;
  channelId: string;
  role: Role;
}

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface User {
      id: string;
      email: string;
      name: string;
      timeZone: string;
      emailVerified: boolean;
    }
    interface Request {
      /** Set by the guard of a channel route: the caller and the path's ids, each checked to be the channel's. */
      channelScope?: { caller: Caller; ids: Partial<Record<ChildParam, string>> };
    }
  }
}

export function mountRoutes(router: Router, routes: RouteSpec[], guards: (spec: RouteSpec) => RequestHandler[]): void {
  for (const spec of routes) {
    router[spec.method](spec.path, ...guards(spec), ...(spec.before ?? []), spec.handler as RequestHandler);
  }
}
