import type { NextFunction, Request, RequestHandler, Response, Router } from "express";
import type { Area, Need, Role } from "../../shared/access/roles";

/**
 * Who may call a route, stated beside it:
 * - public: anyone, signed in or not;
 * - account: any signed-in person;
 * - channel: a member of the route's :channelId whose role has `need` on `area`
 *   (the spec's role table, shared/access/roles.ts). A non-member gets 404, as if the channel did not exist.
 */
export type Access = { kind: "public" } | { kind: "account" } | { kind: "channel"; area: Area; need: Need };

export const publicAccess: Access = { kind: "public" };
export const anyAccount: Access = { kind: "account" };
export const channelAccess = (area: Area, need: Need): Access => ({ kind: "channel", area, need });

export type Method = "get" | "post" | "put" | "patch" | "delete";

export type Handler = (req: Request, res: Response, next: NextFunction) => Promise<unknown> | unknown;

export interface RouteSpec {
  method: Method;
  /** Full path, starting with /api. */
  path: string;
  access: Access;
  /** Body kind a write route takes; JSON unless it says otherwise. */
  body?: "json" | "multipart" | "none";
  /** Served without loading the session (health checks must answer while the database is down). */
  sessionless?: true;
  /** Extra middleware that runs after authorisation (e.g. rate limits). */
  before?: RequestHandler[];
  handler: Handler;
}

export interface MemberContext {
  userId: string;
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
      member?: MemberContext;
    }
  }
}

export function mountRoutes(router: Router, routes: RouteSpec[], guards: (spec: RouteSpec) => RequestHandler[]): void {
  for (const spec of routes) {
    router[spec.method](spec.path, ...guards(spec), ...(spec.before ?? []), spec.handler as RequestHandler);
  }
}
