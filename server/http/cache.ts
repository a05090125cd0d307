import type { RequestHandler } from "express";

/**
 * API answers carry one person's channel data and change at any time: no cache, shared or the
 * browser's, may keep them (RFC 9111 §5.2.2.5). A route that wants caching sets its own header over
 * this one (the board's revision ETag, a preview link's few minutes).
 */
export const noStoreByDefault: RequestHandler = (_req, res, next) => {
  res.set("Cache-Control", "no-store");
  next();
};
