import path from "node:path";
import { existsSync, readFileSync } from "node:fs";
import type { ServerResponse } from "node:http";
import type { Express, Response } from "express";
import expressStaticGzip from "express-static-gzip";
import { type Manifest, PAGE_MODULES, withPagePreloads } from "./page-preloads";

/** Vite names every file under assets/ by its content's hash, so a changed file is a new address. */
const HASHED = `${path.sep}assets${path.sep}`;
export const IMMUTABLE = "public, max-age=31536000, immutable";
export const REVALIDATE = "no-cache";

function cacheFor(res: ServerResponse, file: string): void {
  res.setHeader("Cache-Control", file.includes(HASHED) ? IMMUTABLE : REVALIDATE);
}

/**
 * The built client: files as the build pre-compressed them (brotli, else gzip, else plain), hashed
 * ones cached for a year and everything else revalidated; every other non-API path is answered by
 * index.html, never kept stale, so client routes survive a reload and a new release is seen at once.
 * A page's index.html also asks for that page's code (page-preloads.ts), read from the build's manifest.
 */
export function serveClient(app: Express, dist: string): void {
  const indexFile = path.join(dist, "index.html");
  if (!existsSync(indexFile)) return;
  app.use(
    expressStaticGzip(dist, {
      enableBrotli: true,
      orderPreference: ["br", "gzip"],
      index: false,
      serveStatic: { index: false, cacheControl: false, setHeaders: cacheFor },
    }),
  );
  const html = readFileSync(indexFile, "utf8");
  const manifest = readManifest(dist);
  const sendPage = (page: string) => (_req: unknown, res: Response) => {
    res.setHeader("Cache-Control", REVALIDATE);
    res.type("html").send(page);
  };
  for (const [address, modules] of Object.entries(PAGE_MODULES)) app.get(address, sendPage(manifest ? withPagePreloads(html, manifest, modules) : html));
  app.get("/{*splat}", (req, res, next) => {
    if (req.path.startsWith("/api")) return next();
    sendPage(html)(req, res);
  });
}

/** Vite's build manifest (`build.manifest` in vite.config.ts); a build without one gets plain pages. */
function readManifest(dist: string): Manifest | null {
  const file = path.join(dist, ".vite", "manifest.json");
  return existsSync(file) ? (JSON.parse(readFileSync(file, "utf8")) as Manifest) : null;
}
