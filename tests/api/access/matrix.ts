import type { TestApp } from "../../support/test-app";
import type { createUser } from "../../factories/accounts";

/**
 * The access matrix, split by feature: each file in this folder exports `access: FeatureAccess`
 * with its routes' rows (the expected answer per caller, written by hand from the spec's role table,
 * never computed from shared/access/roles.ts) and a recipe per route. access-matrix.test.ts loads
 * every file here and fails when the app has a route no file lists, or a file lists a route the app
 * doesn't have.
 */
export const callers = ["visitor", "owner", "producer", "editor", "crew", "outsider"] as const;
export type Caller = (typeof callers)[number];

/** "ok": the route does its job; 401 signed out; 403 the role may not; 404 not a member of this channel. */
export type Cell = "ok" | 401 | 403 | 404;
export const ok = "ok";

export type Row = [route: string, visitor: Cell, owner: Cell, producer: Cell, editor: Cell, crew: Cell, outsider: Cell];

export type Person = Awaited<ReturnType<typeof createUser>>;

/** The channel every cell aims at, one account per role, and the owner of another channel. */
export interface AccessWorld {
  channel: { id: string; name: string };
  owner: Person;
  people: Record<Exclude<Caller, "visitor">, Person>;
  episode: { id: string };
}

export interface Call {
  caller: Caller;
  /** The signed-in caller's account; null for the visitor. */
  person: Person | null;
}

export interface Prepared {
  /** Path parameters besides :channelId, which is always the matrix channel. */
  params?: Record<string, string>;
  body?: object;
  /** Run after a refusal: the refused write left its rows as they were. */
  intact?: () => Promise<void>;
}

export interface Recipe {
  /** The status when the caller is let through. */
  ok: number;
  /** Fresh rows for this one call, so no cell depends on another's. */
  prepare?: (call: Call) => Promise<Prepared>;
}

export interface AccessContext {
  app: TestApp;
  world: AccessWorld;
}

export interface FeatureAccess {
  rows: Row[];
  recipes: (context: AccessContext) => Record<string, Recipe>;
}
