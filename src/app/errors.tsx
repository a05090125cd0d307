import { isRouteErrorResponse, Link, useRouteError } from "react-router-dom";
import { AuthCard } from "../components/AuthCard";
import { Button } from "../components/Button";

/** An address that leads nowhere. */
export function NotFound() {
  return (
    <AuthCard title="Nothing here">
      <p className="mb-4 text-graphite-700">That page doesn't exist.</p>
      <Link className="font-semibold text-rust-600 underline" to="/">
        Back to Kerf
      </Link>
    </AuthCard>
  );
}

// A page's code is fetched when first visited: a dropped connection, or an update that replaced the file, fails that fetch.
const staleCode = /dynamically imported module|Importing a module script failed|Failed to fetch/i;

/**
 * What a page shows when it throws: what happened, in plain words, and what to do. Never the stack
 * (that goes to the browser's console, for whoever debugs it). `inShell` keeps the top bar around it.
 */
export function RouteError({ inShell = false }: { inShell?: boolean }) {
  const error = useRouteError();
  if (isRouteErrorResponse(error) && error.status === 404) return <NotFound />;
  console.error(error);
  const updated = error instanceof Error && staleCode.test(error.message);
  const body = (
    <div role="alert" className="flex flex-col items-start gap-3">
      <p className="text-graphite-700">
        {updated
          ? "Part of this page couldn't be downloaded: the connection dropped, or Kerf was updated since the page was opened. Reload the page."
          : "Something on this page went wrong, and Kerf stopped it here. Nothing you saved is lost. Reload the page; if it happens again, tell your channel's owner what you were doing."}
      </p>
      <div className="flex flex-wrap items-center gap-4">
        <Button onClick={() => window.location.reload()}>Reload the page</Button>
        <Link className="font-semibold text-rust-600 underline" to="/">
          Back to Kerf
        </Link>
      </div>
    </div>
  );
  if (!inShell) return <AuthCard title="This page hit a problem">{body}</AuthCard>;
  return (
    <section aria-labelledby="route-error" className="mx-auto max-w-2xl rounded-lg border border-alarm-600/30 bg-white p-6">
      <h1 id="route-error" className="mb-3 text-xl font-bold">
        This page hit a problem
      </h1>
      {body}
    </section>
  );
}
