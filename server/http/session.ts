import connectPgSimple from "connect-pg-simple";
import session from "express-session";
import passport from "passport";
import type pg from "pg";
import type { RequestHandler } from "express";
import type { Database } from "../db/client";
import { findUserById } from "../auth/users.repository";

const PgStore = connectPgSimple(session);

export const SESSION_COOKIE = "kerf.sid";

/** Sessions live in PostgreSQL so any app instance can serve any signed-in person. */
export function sessionMiddleware(pool: pg.Pool, secret: string): RequestHandler {
  return session({
    name: SESSION_COOKIE,
    secret,
    store: new PgStore({ pool, tableName: "session", createTableIfMissing: false, pruneSessionInterval: 15 * 60 }),
    resave: false,
    saveUninitialized: false,
    rolling: true,
    cookie: {
      httpOnly: true,
      sameSite: "lax",
      // Secure whenever the request arrived over TLS (directly, or through a trusted proxy).
      secure: "auto",
      maxAge: 14 * 24 * 60 * 60 * 1000,
    },
  });
}

/** One authenticator per app, so two apps in one process (tests) never read each other's users. */
export function configurePassport(db: Database): passport.Authenticator {
  const authenticator = new passport.Passport();
  authenticator.serializeUser((user, done) => done(null, user.id));
  authenticator.deserializeUser((id: string, done) => {
    findUserById(db, id).then((user) => done(null, user ?? false), done);
  });
  return authenticator;
}
