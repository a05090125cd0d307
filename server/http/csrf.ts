import { createHmac, randomBytes, timingSafeEqual } from "node:crypto";
import type { Request, RequestHandler, Response } from "express";
import { AppError } from "./app-error";

/**
 * Signed double-submit CSRF defence (OWASP CSRF Prevention Cheat Sheet, "Signed Double-Submit
 * Cookie"): the token is a random value and an HMAC over it, made with a key derived from
 * SESSION_SECRET. It travels in a cookie and, on every write, in a header; the two must match and the
 * signature must hold. Signed in, the HMAC also covers the session id, so a token works in one session
 * only and signing in (a new session id) rotates it. Nothing is stored: a visitor who is not signed in
 * costs no session row. Why: docs/decisions/0007-csrf-without-stored-sessions.md.
 */
export const CSRF_HEADER = "x-csrf-token";
export const CSRF_COOKIE = "kerf.csrf";
const safeMethods = new Set(["GET", "HEAD", "OPTIONS"]);
const TOKEN_LIFETIME_MS = 14 * 24 * 60 * 60 * 1000;

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface Request {
      /** The caller's CSRF token: the one its cookie holds when still valid, else a new one set in the answer. */
      csrfToken?: () => string;
    }
  }
}

/** Over TLS the cookie takes the __Host- prefix: no subdomain can then plant one of its own. */
const cookieName = (req: Request) => (req.secure ? `__Host-${CSRF_COOKIE}` : CSRF_COOKIE);

function cookieValue(req: Request, name: string): string | undefined {
  for (const part of (req.get("cookie") ?? "").split(";")) {
    const at = part.indexOf("=");
    if (at > 0 && part.slice(0, at).trim() === name) return part.slice(at + 1).trim();
  }
  return undefined;
}

/** What a token is bound to: the session when someone is signed in, nothing otherwise. */
const bindingOf = (req: Request) => (req.user ? `session:${req.sessionID}` : "anonymous");

function sameText(a: string, b: string): boolean {
  const left = Buffer.from(a);
  const right = Buffer.from(b);
  return left.length === right.length && timingSafeEqual(left, right);
}

function tokenSigner(secret: string) {
  // A key of its own, so a CSRF signature can never stand in for a session cookie's signature.
  const key = createHmac("sha256", secret).update("kerf csrf token key").digest();
  const sign = (binding: string, value: string) => createHmac("sha256", key).update(`${binding}\n${value}`).digest("base64url");
  return {
    issue: (binding: string) => {
      const value = randomBytes(32).toString("base64url");
      return `${value}.${sign(binding, value)}`;
    },
    holds: (binding: string, token: string) => {
      const [value, signature, extra] = token.split(".");
      return !!value && !!signature && extra === undefined && sameText(signature, sign(binding, value));
    },
  };
}

function setTokenCookie(req: Request, res: Response, token: string): void {
  res.cookie(cookieName(req), token, { httpOnly: true, sameSite: "lax", secure: req.secure, path: "/", maxAge: TOKEN_LIFETIME_MS });
}

/** Checks every write and gives each request `req.csrfToken()` for the answers that hand a token out. */
export function csrfProtection(secret: string): RequestHandler {
  const signer = tokenSigner(secret);
  return (req, res, next) => {
    let issued: { binding: string; token: string } | null = null;
    req.csrfToken = () => {
      const binding = bindingOf(req);
      if (issued?.binding === binding) return issued.token;
      const current = cookieValue(req, cookieName(req));
      const token = current && signer.holds(binding, current) ? current : signer.issue(binding);
      if (token !== current) setTokenCookie(req, res, token);
      issued = { binding, token };
      return token;
    };
    if (safeMethods.has(req.method)) return next();
    const sent = req.get(CSRF_HEADER);
    const cookie = cookieValue(req, cookieName(req));
    if (!sent || !cookie || !sameText(sent, cookie) || !signer.holds(bindingOf(req), cookie)) {
      return next(new AppError("csrf_failed", "This form has expired or came from another site. Reload the page and try again."));
    }
    next();
  };
}

export function csrfTokenFor(req: Request): string {
  if (!req.csrfToken) throw new AppError("internal", "CSRF protection is not installed on this route.");
  return req.csrfToken();
}
