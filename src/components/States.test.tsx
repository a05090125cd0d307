import { renderToStaticMarkup } from "react-dom/server";
import { MemoryRouter } from "react-router-dom";
import { describe, expect, it } from "vitest";
import { ApiError } from "../lib/api-client";
import { allOf, QueryState, type QueryLike } from "./States";

// What a person sees of a query: loading, an error in plain words with only the way out that helps,
// empty, or the data. Rendered to HTML in the router, as a page would be.
const back = { to: "/c/1/rushes", label: "Rushes" };
const failed = (error: unknown): QueryLike<string[]> => ({ status: "error", data: undefined, error, refetch: () => undefined });
const loaded = (data: string[]): QueryLike<string[]> => ({ status: "success", data, error: null, refetch: () => undefined });

function render(query: QueryLike<string[]>, at = "/c/1/rushes/clip-9?tab=marks") {
  return renderToStaticMarkup(
    <MemoryRouter initialEntries={[at]}>
      <QueryState query={query} loading="Loading the footage…" back={back} isEmpty={(d) => d.length === 0} empty={<p>No clips yet.</p>}>
        {(clips) => <ul>{clips.map((c) => <li key={c}>{c}</li>)}</ul>}
      </QueryState>
    </MemoryRouter>,
  );
}

describe("QueryState", () => {
  it("says what is loading while there is no data", () => {
    expect(render({ status: "pending", data: undefined, error: null, refetch: () => undefined })).toContain("Loading the footage…");
  });

  it("shows the data, or the empty state when there is none", () => {
    expect(render(loaded(["ACAM_C001.MOV"]))).toContain("<li>ACAM_C001.MOV</li>");
    expect(render(loaded([]))).toContain("No clips yet.");
  });

  it("never offers Try again for a refusal, and gives a way back", () => {
    const html = render(failed(new ApiError(403, "forbidden", "Your role can't see footage.")));
    expect(html).toContain("Not open to your role");
    expect(html).toContain("Your role can&#x27;t see footage.");
    expect(html).not.toContain("Try again");
    expect(html).toContain('href="/c/1/rushes"');
  });

  it("offers a way back from a missing record, not Try again", () => {
    const html = render(failed(new ApiError(404, "not_found", "This clip doesn't exist.")));
    expect(html).toContain("Not found");
    expect(html).toContain("← Rushes");
    expect(html).not.toContain("Try again");
  });

  it.each([
    ["a dropped connection", new ApiError(0, "offline", "Kerf can't reach the server."), "Kerf can&#x27;t reach the server"],
    ["a server fault", new ApiError(503, "storage_unavailable", "Storage is down."), "Kerf&#x27;s server had a problem"],
  ])("offers Try again after %s, and no way back", (_what, error, title) => {
    const html = render(failed(error));
    expect(html).toContain(title);
    expect(html).toContain("Try again");
    expect(html).not.toContain("← Rushes");
  });

  it("sends a signed-out person to sign in and back to the same page", () => {
    const html = render(failed(new ApiError(401, "unauthenticated", "Sign in.")));
    expect(html).toContain("You&#x27;re signed out");
    expect(html).toContain(`href="/sign-in?next=${encodeURIComponent("/c/1/rushes/clip-9?tab=marks")}"`);
    expect(html).not.toContain("Try again");
  });

  it("keeps data on screen when a refetch fails, under a line that says so", () => {
    const html = render({ status: "error", data: ["ACAM_C001.MOV"], error: new ApiError(500, "internal", "Boom."), refetch: () => undefined });
    expect(html).toContain("Kerf&#x27;s server had a problem");
    expect(html).toContain("<li>ACAM_C001.MOV</li>");
  });
});

describe("allOf", () => {
  it("waits for every query, and fails when any fails", () => {
    const waiting: QueryLike<string> = { status: "pending", data: undefined, error: null, refetch: () => undefined };
    const done: QueryLike<number> = { status: "success", data: 2, error: null, refetch: () => undefined };
    const broken: QueryLike<number> = { status: "error", data: undefined, error: new ApiError(500, "internal", "Boom."), refetch: () => undefined };
    expect(allOf(waiting, done).status).toBe("pending");
    expect(allOf({ ...done, data: "a" }, done)).toMatchObject({ status: "success", data: ["a", 2] });
    expect(allOf(done, broken)).toMatchObject({ status: "error", data: undefined, error: broken.error });
  });
});
