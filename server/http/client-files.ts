import path from "node:path";
import { existsSync, readFileSync } from "node:fs";
import type { ServerResponse } from "node:http";
import type { Express, Request, RequestHandler, Response } from "express";
import { brotliCompressSync, constants, gzipSync } from "node:zlib";
import expressStaticGzip from "express-static-gzip";
import { pageDataLink } from "./page-data";
import { EPISODE, type Manifest, PAGE_MODULES, withPagePreloads } from "./page-preloads";

/** How an episode's address without a part finds the part it opens on, to send that part's page. */
export interface OpeningPart {
  /** Reads the visitor's session, when it can be read, before `part`. */
  session: RequestHandler[];
  /** The part the episode opens on for this visitor, or null when the page should not say. */
  part: (req: Request) => Promise<string | null>;
}

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
export function serveClient(app: Express, dist: string, openingPart?: OpeningPart): void {
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
  const html = withInlineStyles(readFileSync(indexFile, "utf8"), dist);
  const manifest = readManifest(dist);
  const sendPage = (page: string, address?: string) => {
    const encoded = compressedPage(page);
    return (req: Request, res: Response) => {
      res.setHeader("Cache-Control", REVALIDATE);
      res.setHeader("Vary", "Accept-Encoding, Cookie");
      const link = pageDataLink(req, address);
      if (link) res.setHeader("Link", link);
      // Brotli whenever it is taken at all (negotiation alone picks by the browser's order, which lists gzip first).
      const encoding = req.acceptsEncodings("br") === "br" ? "br" : req.acceptsEncodings("gzip");
      if (encoding === "br" || encoding === "gzip") res.setHeader("Content-Encoding", encoding);
      res.type("html").send(encoding === "br" ? encoded.br : encoding === "gzip" ? encoded.gzip : encoded.plain);
    };
  };
  const pages = new Map(Object.entries(PAGE_MODULES).map(([address, modules]) => [address, sendPage(manifest ? withPagePreloads(html, manifest, modules) : html, address)]));
  if (openingPart) app.get(EPISODE, ...openingPart.session, withOpeningPart(openingPart, pages));
  for (const [address, page] of pages) app.get(address, page);
  const anyPage = sendPage(html);
  app.get("/{*splat}", (req, res, next) => {
    if (req.path.startsWith("/api")) return next();
    anyPage(req, res);
  });
}

/**
 * An episode's address without a part (the board's links) gets the page of the part its stage opens
 * on, with that part's code and answers asked for in its head, instead of finding the part only once
 * the episode has come. Anyone it can't say for goes on to the plain page.
 */
function withOpeningPart(openingPart: OpeningPart, pages: Map<string, (req: Request, res: Response) => void>): RequestHandler {
  return async (req, res, next) => {
    const part = await openingPart.part(req).catch(() => null);
    const page = part ? pages.get(`${EPISODE}/${part}`) : undefined;
    if (page) page(req, res);
    else next();
  };
}

/** A page's three bodies, made once when the server starts (brotli 5: a few milliseconds a page, within a tenth of 11's size). */
function compressedPage(page: string): { plain: Buffer; br: Buffer; gzip: Buffer } {
  const plain = Buffer.from(page);
  return { plain, br: brotliCompressSync(plain, { params: { [constants.BROTLI_PARAM_QUALITY]: 5 } }), gzip: gzipSync(plain) };
}

/**
 * index.html with the app's stylesheets written into it: the opening screen paints from the first
 * response alone, before any script or style has been fetched, which on a phone's network is most of
 * the first second. Each keeps a disabled link (never fetched) by which Vite's loader of a page's code
 * sees the sheet is already there and does not fetch it again.
 */
export function withInlineStyles(html: string, dist: string): string {
  return html.replace(/<link rel="stylesheet" crossorigin href="\/(assets\/[\w.-]+\.css)">/g, (link, file: string) => {
    const css = path.join(dist, file);
    return existsSync(css) ? `<style>${readFileSync(css, "utf8")}</style><link rel="stylesheet" crossorigin href="/${file}" disabled>` : link;
  });
}

/** Vite's build manifest (`build.manifest` in vite.config.ts); a build without one gets plain pages. */
function readManifest(dist: string): Manifest | null {
  const file = path.join(dist, ".vite", "manifest.json");
  return existsSync(file) ? (JSON.parse(readFileSync(file, "utf8")) as Manifest) : null;
}
