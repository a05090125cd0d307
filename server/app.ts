import path from "node:path";
import { existsSync } from "node:fs";
import express, { type Express } from "express";
import helmet from "helmet";
import type { DatabaseHandle } from "./db/client";
import type { Env } from "./env";
import type { Jobs } from "./jobs/queue";
import type { Mailer } from "./mail/mailer";
import { authRoutes } from "./auth/auth.router";
import { defaultSignInLimits, type SignInLimits } from "./auth/rate-limits";
import { channelRoutes } from "./channels/channels.router";
import { healthRoutes } from "./health/health.router";
import { slateRoutes } from "./slate/slate.router";
import { benchRoutes } from "./bench/bench.router";
import { rushesRoutes } from "./rushes/rushes.router";
import { sponsorsRoutes } from "./sponsors/sponsors.router";
import { csrfProtection } from "./http/csrf";
import { apiNotFound, errorMiddleware } from "./http/error-middleware";
import { guardsFor } from "./http/guards";
import { mountRoutes, type RouteSpec } from "./http/route-table";
import { configurePassport, sessionMiddleware } from "./http/session";

export interface AppDeps {
  env: Env;
  database: DatabaseHandle;
  mailer: Mailer;
  jobs: Pick<Jobs, "enqueueMail">;
  signInLimits?: SignInLimits;
}

/** Every API route with who may call it: the one table the authorisation tests read. */
export function apiRoutes(deps: AppDeps): RouteSpec[] {
  const db = deps.database.db;
  return [
    ...healthRoutes(db, deps.mailer),
    ...authRoutes(db, deps.signInLimits ?? defaultSignInLimits),
    ...channelRoutes({ db, appUrl: deps.env.APP_URL, enqueueMail: (mail) => deps.jobs.enqueueMail(mail) }),
    ...slateRoutes(db),
    ...benchRoutes(deps),
    ...rushesRoutes(deps),
    ...sponsorsRoutes(deps),
  ];
}

const contentSecurityPolicy = {
  directives: {
    defaultSrc: ["'self'"],
    scriptSrc: ["'self'"],
    styleSrc: ["'self'", "'unsafe-inline'"],
    imgSrc: ["'self'", "data:", "blob:"],
    fontSrc: ["'self'", "data:"],
    connectSrc: ["'self'"],
    objectSrc: ["'none'"],
    frameAncestors: ["'none'"],
    formAction: ["'self'"],
    baseUri: ["'self'"],
    upgradeInsecureRequests: null,
  },
};

export function createApp(deps: AppDeps): Express {
  const { env, database } = deps;
  const app = express();
  app.disable("x-powered-by");
  if (env.TRUST_PROXY) app.set("trust proxy", 1);
  app.use(helmet({ contentSecurityPolicy, strictTransportSecurity: env.TRUST_PROXY }));

  const passport = configurePassport(database.db);
  const api = express.Router();
  // Route paths are written in full (/api/…) so the route table reads as the URLs people call.
  api.use("/api", express.json({ limit: "100kb", strict: true }), sessionMiddleware(database.pool, env.SESSION_SECRET), passport.session(), csrfProtection);
  mountRoutes(api, apiRoutes(deps), guardsFor(database.db));
  api.use("/api", apiNotFound);
  app.use(api);
  serveClient(app, path.resolve(env.CLIENT_DIST));
  app.use(errorMiddleware);
  return app;
}

/** The built client, with every non-API path answered by index.html so client routes survive a reload. */
function serveClient(app: Express, dist: string): void {
  if (!existsSync(path.join(dist, "index.html"))) return;
  app.use(express.static(dist, { index: false, maxAge: "1h" }));
  app.get("/{*splat}", (req, res, next) => {
    if (req.path.startsWith("/api")) return next();
    res.sendFile(path.join(dist, "index.html"));
  });
}
