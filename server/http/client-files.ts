import path from "node:path";
import { existsSync } from "node:fs";
import type { ServerResponse } from "node:http";
import type { Express } from "express";
import expressStaticGzip from "express-static-gzip";

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
  app.get("/{*splat}", (req, res, next) => {
    if (req.path.startsWith("/api")) return next();
    res.setHeader("Cache-Control", REVALIDATE);
    res.sendFile(indexFile);
  });
}
