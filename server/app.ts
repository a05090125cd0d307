import path from "node:path";
import express, { type Express } from "express";
import helmet from "helmet";
import { accountRoutes } from "./auth/account.router";
import { authRoutes } from "./auth/auth.router";
import { passwordResetRoutes } from "./auth/password-reset.router";
import { passwordResetMailRenderer } from "./auth/password-reset.service";
import { defaultSignInLimits, type SignInLimits } from "./auth/rate-limits";
import { findLiveSession, findUserById } from "./auth/users.repository";
import { verificationRoutes } from "./auth/verification.router";
import { addressChangeMailRenderer, verificationMailRenderer } from "./auth/verification.service";
import { benchRoutes } from "./bench/bench.router";
import { benchGates } from "./bench/bench.gates";
import { benchPublishSource } from "./bench/bench.publish";
import { calendarRoutes } from "./calendar/calendar.router";
import type { CalendarPlugs } from "./calendar/calendar.service";
import { channelRoutes } from "./channels/channels.router";
import { economicsRoutes } from "./economics/economics.router";
import { invitationMailRenderer } from "./channels/invitations.service";
import { benchNeeds } from "./bench/bench.needs";
import { healthRoutes } from "./health/health.router";
import { homeRoutes } from "./home/home.router";
import { intakeMailRenderers } from "./intake/intake.mail";
import { intakeFollowsGoLive } from "./intake/intake.publish";
import { intakeRoutes } from "./intake/intake.router";
import { newsTokens } from "./intake/news-token";
import type { PageLimits } from "./intake/page-limits";
import { noStoreByDefault } from "./http/cache";
import { serveClient } from "./http/client-files";
import { csrfProtection } from "./http/csrf";
import { apiNotFound, errorMiddleware } from "./http/error-middleware";
import { guardsFor } from "./http/guards";
import { bodyReaders } from "./http/json-body";
import { mountRoutes, type RouteSpec } from "./http/route-table";
import { bestEffort, configurePassport, sessionMiddleware } from "./http/session";
import type { MailRenderers } from "./mail/mail-jobs";
import { memberMailRenderer } from "./mail/member-mail";
import { rushesNeeds } from "./rushes/rushes.needs";
import { rushesCalendar } from "./rushes/rushes.calendar";
import { publishCalendar } from "./publish/publish.calendar";
import { publishRoutes, type PublishPlugs } from "./publish/publish.router";
import { rushesPublishSource } from "./rushes/rushes.publish";
import { rushesRoutes } from "./rushes/rushes.router";
import type { AppDeps } from "./seams/app-deps";
import type { ChannelStarter } from "./seams/channel-starters";
import type { NeedSource } from "./seams/home-needs";
import type { SlatePlugs } from "./seams/slate-plugs";
import { episodeOpeningPart } from "./slate/episode-page";
import { slateCalendar, slatePublishDateMover } from "./slate/slate.calendar";
import { slateNeeds } from "./slate/slate.needs";
import { makeViewerEpisode } from "./slate/episodes.service";
import { slateRoutes } from "./slate/slate.router";
import { sponsorBoardFilter, sponsorFlagSources } from "./sponsors/sponsors.flags";
import { sponsorGates } from "./sponsors/sponsors.gates";
import { sponsorNeeds } from "./sponsors/sponsors.needs";
import { sponsorsCalendar } from "./sponsors/sponsors.calendar";
import { sponsorsFollowGoLive, sponsorsPublishSource } from "./sponsors/sponsors.publish";
import { invoiceMailRenderer } from "./sponsors/invoice-mail";
import { reviewLinkMailRenderer } from "./sponsors/review.service";
import { reportTokens, reviewTokens } from "./sponsors/review-token";
import { sponsorsFollowPublishDate } from "./sponsors/schedule.service";
import { searchRoutes } from "./search/search.router";
import { sponsorsRoutes } from "./sponsors/sponsors.router";
import { reportMailRenderer } from "./sponsors/reports.service";
import { publishedVideo } from "./publish/publish.video";
import { startWithDealTemplate } from "./sponsors/templates.service";

/** Settings of one app that are not dependencies (tests tighten them). */
export interface AppOptions {
  signInLimits?: SignInLimits;
  /** Submissions one address may send the public suggestion pages (server/intake/page-limits.ts). */
  suggestionLimits?: PageLimits;
}

/**
 * What the features plug into the slate. This is the one place a feature's gates, board flags,
 * board filters and publish-date followers are named; the slate knows only the contracts in server/seams/.
 */
export const slatePlugs: SlatePlugs = {
  stageGates: [...benchGates, ...sponsorGates],
  boardFlags: [...sponsorFlagSources],
  boardFilters: { sponsor: sponsorBoardFilter },
  publishDateFollowers: [sponsorsFollowPublishDate],
};

/** What the publish package drafts from and checks against, and who follows the video going live. */
export function publishPlugs(deps: Pick<AppDeps, "jobs">): PublishPlugs {
  return {
    sources: [sponsorsPublishSource, benchPublishSource, rushesPublishSource],
    goLiveFollowers: [sponsorsFollowGoLive, intakeFollowsGoLive(deps.jobs)],
  };
}

/**
 * What builds each kind of queued mail when it is sent (server/mail/mail-jobs.ts): the one place a
 * feature's mail renderers are named. Every instance that runs the mail worker passes these to
 * `jobs.startMailWorker`.
 */
export function mailRenderers(deps: Pick<AppDeps, "env" | "database">): MailRenderers {
  const db = deps.database.db;
  const appUrl = deps.env.APP_URL;
  return {
    ...memberMailRenderer(db),
    ...verificationMailRenderer({ db, appUrl }),
    ...addressChangeMailRenderer({ db, appUrl }),
    ...passwordResetMailRenderer({ db, appUrl }),
    ...invitationMailRenderer({ db, appUrl }),
    ...reviewLinkMailRenderer({ db, appUrl, tokens: reviewTokens(deps.env.SESSION_SECRET) }),
    ...invoiceMailRenderer(db),
    ...intakeMailRenderers({ db, appUrl, tokens: newsTokens(deps.env.SESSION_SECRET) }),
    ...reportMailRenderer({ db, appUrl, tokens: reportTokens(deps.env.SESSION_SECRET) }),
  };
}

/** What fills members' homes ("what needs me"): the one place a feature's home entries are named. */
export const needSources: readonly NeedSource[] = [...slateNeeds(slatePlugs), ...benchNeeds, ...rushesNeeds, ...sponsorNeeds];

/** What the calendar shows, one source per feature, and how it previews a publish-date move: the one place they are named. */
export const calendarPlugs: CalendarPlugs = {
  sources: [slateCalendar, publishCalendar, rushesCalendar, sponsorsCalendar],
  movePublishDate: slatePublishDateMover(slatePlugs.publishDateFollowers),
};

/** What every new channel starts with, made in the transaction that makes the channel. */
export const channelStarters: readonly ChannelStarter[] = [startWithDealTemplate];

/** Every API route with who may call it: the one table the authorisation tests read. */
export function apiRoutes(deps: AppDeps, options: AppOptions = {}): RouteSpec[] {
  const db = deps.database.db;
  const mailing = { db, appUrl: deps.env.APP_URL, jobs: deps.jobs, channelStarters };
  const limits = options.signInLimits ?? defaultSignInLimits;
  return [
    ...healthRoutes(db, deps.mailer, deps.storage),
    ...authRoutes(mailing, limits),
    ...verificationRoutes(mailing),
    ...passwordResetRoutes(mailing, limits),
    ...accountRoutes(mailing, limits),
    ...channelRoutes(mailing),
    ...slateRoutes(deps, slatePlugs),
    ...benchRoutes(deps),
    ...rushesRoutes(deps),
    ...sponsorsRoutes(deps, publishedVideo),
    ...homeRoutes(db, needSources),
    ...publishRoutes(deps, publishPlugs(deps)),
    ...searchRoutes(deps),
    ...calendarRoutes(deps, calendarPlugs),
    ...economicsRoutes(deps),
    ...intakeRoutes(deps, { makeEpisode: makeViewerEpisode, pageLimits: options.suggestionLimits }),
  ];
}

// Pages upload to, preview from and show posters from the object store's own origin (presigned URLs);
// mediainfo.js reads media metadata in WebAssembly, which needs 'wasm-unsafe-eval' (not 'unsafe-eval').
const contentSecurityPolicy = (storageOrigin: string) => ({
  directives: {
    defaultSrc: ["'self'"],
    scriptSrc: ["'self'", "'wasm-unsafe-eval'"],
    styleSrc: ["'self'", "'unsafe-inline'"],
    imgSrc: ["'self'", "data:", "blob:", storageOrigin],
    mediaSrc: ["'self'", "blob:", storageOrigin],
    fontSrc: ["'self'", "data:"],
    connectSrc: ["'self'", storageOrigin],
    objectSrc: ["'none'"],
    frameAncestors: ["'none'"],
    formAction: ["'self'"],
    baseUri: ["'self'"],
    upgradeInsecureRequests: null,
  },
});

export function createApp(deps: AppDeps, options: AppOptions = {}): Express {
  const { env, database } = deps;
  const app = express();
  app.disable("x-powered-by");
  if (env.TRUST_PROXY) app.set("trust proxy", 1);
  app.use(helmet({ contentSecurityPolicy: contentSecurityPolicy(deps.storage.publicOrigin), strictTransportSecurity: env.TRUST_PROXY }));

  const passport = configurePassport((id) => findUserById(database.db, id));
  const api = express.Router();
  // Route paths are written in full (/api/…) so the route table reads as the URLs people call.
  const routes = apiRoutes(deps, options);
  const guards = guardsFor(database.db);
  const loadSession = [sessionMiddleware(database.pool, env.SESSION_SECRET, (sid) => findLiveSession(database.db, sid)), passport.session()];
  // In this order: no answer is cached; bodies are read, and bad ones refused, before any session or
  // database work; the health check answers whether or not sessions can be read; then the rest.
  api.use("/api", noStoreByDefault);
  api.use(bodyReaders(routes));
  mountRoutes(api, routes.filter((route) => route.signedByCaller), guards);
  const sessionWhenReachable = bestEffort(loadSession);
  mountRoutes(api, routes.filter((route) => route.sessionOptional), (spec) => [sessionWhenReachable, ...guards(spec)]);
  api.use("/api", ...loadSession, csrfProtection(env.SESSION_SECRET));
  mountRoutes(api, routes.filter((route) => !route.sessionOptional && !route.signedByCaller), guards);
  api.use("/api", apiNotFound);
  app.use(api);
  serveClient(app, path.resolve(env.CLIENT_DIST), { session: [sessionWhenReachable], part: episodeOpeningPart(database.db) });
  app.use(errorMiddleware);
  return app;
}
