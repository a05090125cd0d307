import { randomBytes, timingSafeEqual } from "node:crypto";
import type { Request, RequestHandler } from "express";
import { AppError } from "./app-error";

/**
 * Synchronizer-token CSRF defence (OWASP CSRF Prevention Cheat Sheet): the session holds a random
 * token, the client reads it from /api/auth/me and echoes it in a header on every write. A page on
 * another site can neither read the token nor set the header without a CORS preflight we never grant.
 */
export const CSRF_HEADER = "x-csrf-token";
const safeMethods = new Set(["GET", "HEAD", "OPTIONS"]);

declare module "express-session" {
  interface SessionData {
    csrfToken?: string;
  }
}

export function csrfTokenFor(req: Request): string {
  req.session.csrfToken ??= randomBytes(32).toString("base64url");
  return req.session.csrfToken;
}

function sameToken(a: string, b: string): boolean {
  const left = Buffer.from(a);
  const right = Buffer.from(b);
  return left.length === right.length && timingSafeEqual(left, right);
}

export const csrfProtection: RequestHandler = (req, _res, next) => {
  if (safeMethods.has(req.method)) return next();
  const sent = req.get(CSRF_HEADER);
  const expected = req.session?.csrfToken;
  if (!sent || !expected || !sameToken(sent, expected)) {
    return next(new AppError("csrf_failed", "This form has expired or came from another site. Reload the page and try again."));
  }
  next();
};
