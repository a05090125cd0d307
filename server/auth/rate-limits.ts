import { rateLimit, ipKeyGenerator } from "express-rate-limit";
import type { RequestHandler } from "express";
import { AppError } from "../http/app-error";

export interface SignInLimits {
  /** Failed attempts allowed per account in the window. */
  perAccount: number;
  /** Attempts (failed or not) allowed per address in the window. */
  perAddress: number;
  windowMs: number;
}

export const defaultSignInLimits: SignInLimits = { perAccount: 5, perAddress: 50, windowMs: 15 * 60_000 };

const tooMany: Parameters<typeof rateLimit>[0] = {
  standardHeaders: "draft-8",
  legacyHeaders: false,
  handler: (_req, _res, next) => next(new AppError("rate_limited", "Too many sign-in attempts. Wait a few minutes and try again.")),
};

function accountKey(body: unknown): string {
  const email = (body as { email?: unknown } | undefined)?.email;
  return typeof email === "string" ? email.trim().toLowerCase() : "(none)";
}

/**
 * Two limits on sign-in: failures per account (guessing one person's password from many
 * addresses) and attempts per address (one address trying many accounts).
 * Counters live in the instance's memory; behind several instances use a shared store.
 */
export function signInRateLimits(limits: SignInLimits): RequestHandler[] {
  const perAddress = rateLimit({ ...tooMany, windowMs: limits.windowMs, limit: limits.perAddress, keyGenerator: (req) => ipKeyGenerator(req.ip ?? "") });
  const perAccount = rateLimit({
    ...tooMany,
    windowMs: limits.windowMs,
    limit: limits.perAccount,
    skipSuccessfulRequests: true,
    keyGenerator: (req) => accountKey(req.body),
  });
  return [perAddress, perAccount];
}
