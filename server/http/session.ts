import connectPgSimple from "connect-pg-simple";
import session from "express-session";
import passport from "passport";
import type pg from "pg";
import type { Request, RequestHandler } from "express";
import type { Role } from "../../shared/access/roles";

const PgStore = connectPgSimple(session);

/** How long a session's expiry may lag its last request on this instance (out of fourteen days). */
const TOUCH_EVERY_MS = 10 * 60 * 1000;
const TOUCHES_REMEMBERED = 20_000;

/** A stored session read with its person and their roles by channel (`findLiveSession`). */
export interface SessionRead {
  sess: unknown;
  user: Express.User | null;
  roles: Record<string, Role>;
}
export type ReadSession = (sid: string) => Promise<SessionRead | null>;

/** What the store read, by the session data it answered, then by the request that data became. */
const readsBySession = new WeakMap<object, SessionRead>();
const readsByRequest = new WeakMap<Request, SessionRead>();

/**
 * The caller's role in each of their channels, read with their session at the start of this request;
 * undefined when the request's session was not read that way.
 */
export function rolesReadWithSession(req: Request): Record<string, Role> | undefined {
  const read = readsByRequest.get(req);
  return read?.user && read.user.id === req.user?.id ? read.roles : undefined;
}

/**
 * The store moves a session's expiry forward on every request (rolling sessions), which is a write
 * for every read. This one writes it at most once per ten minutes per session on each instance:
 * a session may end up to ten minutes early after fourteen idle days, and most requests write nothing.
 */
class SessionStore extends PgStore {
  readonly #touchedAt = new Map<string, number>();
  readonly #read: ReadSession;

  constructor(options: ConstructorParameters<typeof PgStore>[0], read: ReadSession) {
    super(options);
    this.#read = read;
  }

  /**
   * The session, its person and their roles in one query; passport and the channel guards use what it
   * read. (connect-pg-simple's own read also started its pruning timer; its touch, at every instance's
   * first request of a session, still does.)
   */
  override get(sid: string, callback: (err: unknown, session?: session.SessionData | null) => void): void {
    this.#read(sid).then((read) => {
      if (!read) return callback(null, null);
      readsBySession.set(read.sess as object, read);
      callback(null, read.sess as session.SessionData);
    }, callback);
  }

  override createSession(req: Request, sess: session.SessionData): session.Session & session.SessionData {
    const read = readsBySession.get(sess);
    if (read) readsByRequest.set(req, read);
    return super.createSession(req, sess);
  }

  override touch(sid: string, sess: session.SessionData, callback?: (err?: unknown) => void): void {
    const now = Date.now();
    const last = this.#touchedAt.get(sid);
    if (last !== undefined && now - last < TOUCH_EVERY_MS) return callback?.();
    this.#touchedAt.delete(sid);
    this.#touchedAt.set(sid, now);
    if (this.#touchedAt.size > TOUCHES_REMEMBERED) this.#touchedAt.delete(this.#touchedAt.keys().next().value!);
    super.touch(sid, sess, callback);
  }
}

export const SESSION_COOKIE = "kerf.sid";
/** A session ends fourteen days after its last request (rolling), so its last request was `expire` minus this. */
export const SESSION_MAX_AGE_MS = 14 * 24 * 60 * 60 * 1000;

declare module "express-session" {
  interface SessionData {
    /** When the person signed in (ISO instant), for their list of sessions. */
    startedAt?: string;
    /** Browser and system the session signed in from, in a few words. */
    device?: string;
  }
}

/** Sessions live in PostgreSQL so any app instance can serve any signed-in person. */
export function sessionMiddleware(pool: pg.Pool, secret: string, read: ReadSession): RequestHandler {
  return session({
    name: SESSION_COOKIE,
    secret,
    store: new SessionStore({ pool, tableName: "session", createTableIfMissing: false, pruneSessionInterval: 15 * 60 }, read),
    resave: false,
    saveUninitialized: false,
    rolling: true,
    cookie: {
      httpOnly: true,
      sameSite: "lax",
      // Secure whenever the request arrived over TLS (directly, or through a trusted proxy).
      secure: "auto",
      maxAge: SESSION_MAX_AGE_MS,
    },
  });
}

/**
 * One authenticator per app, so two apps in one process (tests) never read each other's users.
 * `findUser` reads the signed-in person by id; server/app.ts hands in the accounts' own lookup.
 */
export function configurePassport(findUser: (id: string) => Promise<Express.User | null>): passport.Authenticator {
  const authenticator = new passport.Passport();
  authenticator.serializeUser((user, done) => done(null, user.id));
  // Three arguments: passport hands in the request, so the person read with the session is used.
  authenticator.deserializeUser((req: Request, id: string, done: (err: unknown, user?: Express.User | false) => void) => {
    const read = readsByRequest.get(req);
    if (read?.user?.id === id) return done(null, read.user);
    findUser(id).then((user) => done(null, user ?? false), done);
  });
  return authenticator;
}

/**
 * Runs the session middlewares in turn but never fails the request: when the store can't be read
 * (the database is down), the caller goes on as signed out.
 */
export function bestEffort(handlers: RequestHandler[]): RequestHandler {
  return (req, res, next) => {
    const run = (index: number) => {
      if (index === handlers.length) return next();
      handlers[index]!(req, res, (error?: unknown) => {
        if (!error) return run(index + 1);
        req.user = undefined;
        next();
      });
    };
    run(0);
  };
}
