import { rateLimit, ipKeyGenerator, type Options } from "express-rate-limit";
import type { Request, RequestHandler } from "express";
import type { Database } from "../db/client";
import { AppError } from "../http/app-error";
import { PostgresRateCounters } from "../http/rate-counters";

export interface SignInLimits {
  /** Failed sign-ins allowed for one account from one address in the window. */
  perAccount: number;
  /** Failed sign-ins allowed for one account from every address together (default: 20 × perAccount). */
  perAccountEverywhere?: number;
  /** Failed sign-ins allowed from one address, whatever the account. */
  perAddress: number;
  /** Sign-ups (accounts made or addresses found taken) allowed from one address in the window (default 10). */
  signUpsPerAddress?: number;
  /** "Forgot password" requests allowed from one address in the window (default 10). */
  resetsPerAddress?: number;
  windowMs: number;
}

export const defaultSignInLimits: SignInLimits = { perAccount: 5, perAccountEverywhere: 100, perAddress: 50, signUpsPerAddress: 10, windowMs: 15 * 60_000 };

const refusal = (message: string): Pick<Options, "standardHeaders" | "legacyHeaders" | "handler"> => ({
  standardHeaders: "draft-8",
  legacyHeaders: false,
  handler: (_req, _res, next) => next(new AppError("rate_limited", message)),
});
const tooManySignIns = refusal("Too many sign-in attempts. Wait a few minutes and try again.");

const addressOf = (req: Request) => ipKeyGenerator(req.ip ?? "");

function accountOf(req: Request): string {
  const email = (req.body as { email?: unknown } | undefined)?.email;
  return typeof email === "string" ? email.trim().toLowerCase() : "(none)";
}

/**
 * Three limits on failed sign-ins, counted per window; a success uncounts itself:
 * - per address: one address guessing at many accounts;
 * - per account and address: guessing one account's password slows the guesser's address, not the
 *   account, so nobody can lock a person out by typing wrong passwords for them (OWASP Authentication
 *   Cheat Sheet, "Account Lockout": lockout lets an attacker deny service);
 * - per account from everywhere, a far higher ceiling: guessing one account from many addresses. Each
 *   address adds at most `perAccount` to it before its own limit stops it, so reaching it takes
 *   `perAccountEverywhere / perAccount` addresses (twenty by default) working together.
 * Counters live in PostgreSQL, so every server process counts the same tries.
 */
export function signInRateLimits(db: Database, limits: SignInLimits): RequestHandler[] {
  const failures = { ...tooManySignIns, windowMs: limits.windowMs, skipSuccessfulRequests: true };
  return [
    rateLimit({ ...failures, store: new PostgresRateCounters(db, "sign-in address"), limit: limits.perAddress, keyGenerator: addressOf }),
    rateLimit({ ...failures, store: new PostgresRateCounters(db, "sign-in account and address"), limit: limits.perAccount, keyGenerator: (req) => `${accountOf(req)} from ${addressOf(req)}` }),
    rateLimit({ ...failures, store: new PostgresRateCounters(db, "sign-in account"), limit: limits.perAccountEverywhere ?? limits.perAccount * 20, keyGenerator: accountOf }),
  ];
}

/**
 * Sign-ups per address: each one that makes an account, or finds the address already taken, counts;
 * a form sent back for a mistake (400) does not.
 */
export function signUpRateLimit(db: Database, limits: SignInLimits): RequestHandler {
  return rateLimit({
    store: new PostgresRateCounters(db, "sign-up address"),
    ...refusal("Too many sign-ups from this network. Wait a while and try again."),
    windowMs: limits.windowMs,
    limit: limits.signUpsPerAddress ?? 10,
    keyGenerator: addressOf,
    skipFailedRequests: true,
    requestWasSuccessful: (_req, res) => res.statusCode !== 400,
  });
}

/**
 * "Forgot password" requests per address, every one counted (a mail may go out for each). Each
 * address asked about also has its own allowance of mails (server/mail/quotas.ts).
 */
export function passwordResetRateLimit(db: Database, limits: SignInLimits): RequestHandler {
  return rateLimit({
    store: new PostgresRateCounters(db, "password link address"),
    ...refusal("Too many requests for password links from this network. Wait a few minutes and try again."),
    windowMs: limits.windowMs,
    limit: limits.resetsPerAddress ?? 10,
    keyGenerator: addressOf,
  });
}

/** Links tried from one address: a wrong or used one counts, so nobody can guess at tokens for long. */
export function resetLinkRateLimit(db: Database, limits: SignInLimits): RequestHandler {
  return rateLimit({
    store: new PostgresRateCounters(db, "password link tries"),
    ...refusal("Too many tries from this network. Wait a few minutes and try again."),
    windowMs: limits.windowMs,
    limit: limits.perAddress,
    keyGenerator: addressOf,
    skipSuccessfulRequests: true,
  });
}

/** Wrong current passwords on the account page, per account: a stolen session can't guess the password for long. */
export function currentPasswordRateLimit(db: Database, limits: SignInLimits, form: "email" | "password"): RequestHandler {
  return rateLimit({
    store: new PostgresRateCounters(db, `current password on the ${form} form`),
    ...refusal("Too many wrong passwords. Wait a few minutes and try again."),
    windowMs: limits.windowMs,
    limit: limits.perAccount,
    keyGenerator: (req) => `account ${req.user?.id ?? "(none)"}`,
    skipSuccessfulRequests: true,
  });
}
