import { renderToStaticMarkup } from "react-dom/server";
import { createStaticHandler, createStaticRouter, StaticRouterProvider, type RouteObject } from "react-router-dom";
import { afterEach, describe, expect, it, vi } from "vitest";
import { NotFound, RouteError } from "./errors";

// The root error page: a page that throws shows what happened in plain words and what to do, never
// the error's own text or stack; an address that leads nowhere keeps the friendly page.
const routes: RouteObject[] = [
  {
    errorElement: <RouteError />,
    children: [
      {
        path: "/broken",
        loader: () => {
          throw new TypeError("Cannot read properties of undefined (reading 'stage')");
        },
        Component: () => null,
      },
      { path: "/stale", loader: () => Promise.reject(new TypeError("Failed to fetch dynamically imported module: /assets/SlatePage-x.js")), Component: () => null },
      { path: "*", element: <NotFound /> },
    ],
  },
];

async function renderAt(path: string): Promise<string> {
  const handler = createStaticHandler(routes);
  const context = await handler.query(new Request(`http://kerf.test${path}`));
  if (context instanceof Response) throw new Error("unexpected redirect");
  return renderToStaticMarkup(<StaticRouterProvider router={createStaticRouter(handler.dataRoutes, context)} context={context} hydrate={false} />);
}

describe("the root error page", () => {
  afterEach(() => vi.restoreAllMocks());

  it("words a thrown error for people and keeps its text and stack out of the page", async () => {
    const logged = vi.spyOn(console, "error").mockImplementation(() => undefined);
    const html = await renderAt("/broken");
    expect(html).toContain("This page hit a problem");
    expect(html).toContain("Nothing you saved is lost");
    expect(html).toContain("Reload the page");
    expect(html).not.toMatch(/Cannot read properties|TypeError|at \w+ \(/);
    expect(logged).toHaveBeenCalled();
  });

  it("says a page's code couldn't be downloaded when the fetch of a page failed", async () => {
    vi.spyOn(console, "error").mockImplementation(() => undefined);
    const html = await renderAt("/stale");
    expect(html).toContain("Part of this page couldn&#x27;t be downloaded");
    expect(html).not.toContain("/assets/");
  });

  it("keeps the friendly page for an unknown address", async () => {
    const html = await renderAt("/no/such/page");
    expect(html).toContain("That page doesn&#x27;t exist.");
    expect(html).toContain('href="/"');
  });
});
