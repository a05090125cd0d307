import { type ReactNode, useDeferredValue } from "react";
import { Link, useLocation } from "react-router-dom";
import { ApiError } from "../lib/api-client";
import { Button } from "./Button";

/**
 * What a page shows while its data loads, when it can't load, and when there is none. `QueryState`
 * decides between them for one query (or several through `allOf`), so no page checks `isPending`,
 * `isError` or an empty list by hand.
 */

/**
 * Waiting for data. It keeps its room (so what follows doesn't move when the data comes) and shows
 * itself only after a moment, so a quick answer never flashes a spinner.
 */
export function Loading({ label = "Loading…", page = false }: { label?: string; page?: boolean }) {
  return (
    <div role="status" className={`flex items-center gap-3 p-8 text-graphite-500 ${page ? "min-h-[40vh] items-start" : "min-h-24"}`}>
      <span className="kerf-appear flex items-center gap-3">
        <span className="size-4 rounded-full border-2 border-rust-600 border-t-transparent motion-safe:animate-spin" aria-hidden />
        {label}
      </span>
    </div>
  );
}

export function Empty({ title, children }: { title: string; children?: ReactNode }) {
  return (
    <div className="flex flex-col items-center gap-2 rounded-lg border border-dashed border-ply-300 p-8 text-center">
      <p className="font-semibold text-graphite-700">{title}</p>
      {children && <div className="text-sm text-graphite-500">{children}</div>}
    </div>
  );
}

/** Where a missing record sends the person back to: the list it came from. */
export interface Back {
  to: string;
  label: string;
}

interface Explained {
  title: string;
  text: string;
  retry: boolean;
  back: boolean;
}

/** An error in words a person understands, and what they can do about it. */
export function explain(error: unknown): Explained {
  if (!(error instanceof ApiError)) {
    return { title: "Something went wrong on this page", text: "Kerf hit a problem it didn't expect. Try again; if it keeps happening, reload the page.", retry: true, back: false };
  }
  if (error.status === 0) return { title: "Kerf can't reach the server", text: "Check your connection, then try again.", retry: true, back: false };
  if (error.status === 401) return { title: "You're signed out", text: "Your session has ended. Sign in again to carry on where you were.", retry: false, back: false };
  if (error.status === 403) {
    return { title: "Not open to your role", text: `${error.message} Ask the channel's owner if you need it: the owner sets each member's role.`, retry: false, back: true };
  }
  if (error.status === 404) return { title: "Not found", text: `${error.message} It may have been deleted, or the link may be wrong.`, retry: false, back: true };
  if (error.status >= 500) return { title: "Kerf's server had a problem", text: "It is usually brief. Try again in a moment.", retry: true, back: false };
  return { title: "This didn't load", text: error.message, retry: false, back: true };
}

/** Words for a missing record where the generic ones won't do (a link from an e-mail, say). */
export interface Missing {
  title: string;
  text: string;
}

/** A link that was never good keeps the page's own words; one that was and no longer opens (410) says why, in the server's. */
function explainMissing(missing: Missing, error: ApiError) {
  return { title: missing.title, text: error.status === 410 ? error.message : missing.text, retry: false, back: true };
}

export function LoadError({ error, retry, back, missing }: { error: unknown; retry?: () => void; back?: Back; missing?: Missing }) {
  const explained = missing && error instanceof ApiError && (error.status === 404 || error.status === 410) ? explainMissing(missing, error) : explain(error);
  const signedOut = error instanceof ApiError && error.status === 401;
  const here = useLocation();
  return (
    <div role="alert" className="m-4 flex flex-col items-start gap-3 rounded-lg border border-alarm-600/30 bg-white p-6">
      <p className="font-semibold text-alarm-600">{explained.title}</p>
      <p className="text-sm text-graphite-700">{explained.text}</p>
      {explained.retry && retry && (
        <Button tone="quiet" onClick={retry}>
          Try again
        </Button>
      )}
      {signedOut && (
        <Link className="text-sm font-semibold text-rust-600 underline" to={`/sign-in?next=${encodeURIComponent(here.pathname + here.search)}`}>
          Sign in
        </Link>
      )}
      {explained.back && back && (
        <Link className="text-sm font-semibold text-rust-600 underline" to={back.to}>
          ← {back.label}
        </Link>
      )}
    </div>
  );
}

/** What `QueryState` reads of a query (TanStack Query's result has all of it). */
export interface QueryLike<T> {
  status: "pending" | "error" | "success";
  data: T | undefined;
  error: unknown;
  refetch: () => unknown;
}

/** Several queries as one: waiting until every one has its data, failed when any failed. */
export function allOf<T extends unknown[]>(...queries: { [K in keyof T]: QueryLike<T[K]> }): QueryLike<T> {
  const failed = queries.find((q) => q.status === "error" && q.data === undefined);
  const waiting = queries.some((q) => q.data === undefined);
  return {
    status: failed ? "error" : waiting ? "pending" : "success",
    data: waiting ? undefined : (queries.map((q) => q.data) as T),
    error: failed?.error ?? null,
    refetch: () => Promise.all(queries.filter((q) => q.status === "error").map((q) => q.refetch())),
  };
}

/**
 * One query's states: loading, an error in plain words (retry only where it can help, a way back
 * where the record is missing), empty, or its data. Data already on screen stays there when a
 * refetch fails, under a line that says so.
 */
export function QueryState<T>({
  query,
  loading,
  page = false,
  back,
  missing,
  isEmpty,
  empty,
  children,
}: {
  query: QueryLike<T>;
  /** What is loading, in words: "Loading the slate…". */
  loading?: string;
  /** A whole page (its loading state keeps more room). */
  page?: boolean;
  back?: Back;
  missing?: Missing;
  isEmpty?: (data: T) => boolean;
  empty?: ReactNode;
  children: (data: T) => ReactNode;
}) {
  const retry = () => void query.refetch();
  // Data that has just arrived is first drawn in a render React can pause, so a big part doesn't block
  // a tap while it is drawn; later changes, and data going away, show at once (never another record's).
  const arrived = useDeferredValue(query.data !== undefined);
  const data = arrived ? query.data : undefined;
  if (data === undefined) {
    if (query.status === "error") return <LoadError error={query.error} retry={retry} back={back} missing={missing} />;
    return <Loading label={loading} page={page} />;
  }
  return (
    <>
      {query.status === "error" && <LoadError error={query.error} retry={retry} back={back} missing={missing} />}
      {isEmpty?.(data) ? empty : children(data)}
    </>
  );
}
