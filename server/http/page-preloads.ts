/**
 * The source modules each page's code starts from, by the address Express matches, as
 * src/app/router.tsx loads them. With them in index.html's head the browser fetches a page's code
 * alongside the app's own script instead of after it has run: one round trip fewer before the first
 * paint, which on a phone's network is most of the wait. tests/unit/page-preloads.test.ts checks that
 * every page the router loads is named here.
 */
const SHELL = "src/app/layouts/AppShell.tsx";
const auth = (page: string) => `src/features/auth/components/${page}.tsx`;
const inShell = (module: string) => [SHELL, module];
export const CHANNEL = "/c/:channelId";
export const EPISODE = `${CHANNEL}/episodes/:episodeId`;
const EPISODE_PAGE = "src/app/episode-page.tsx";

/**
 * Each part of the episode page by its name in the address, and the module its code starts from, as
 * src/app/episode-sections.tsx loads it: an address that names a part (a reload, a link in a mail)
 * asks for that part's code with the page's.
 */
export const PART_MODULES: Record<string, string> = {
  "test-plan": "src/features/bench/components/TestPlanSheet.tsx",
  bench: "src/features/bench/components/BenchSection.tsx",
  "build-log": "src/features/bench/components/BuildLogSection.tsx",
  shoot: "src/features/rushes/components/EpisodeRushes.tsx",
  footage: "src/features/rushes/components/EpisodeRushes.tsx",
  "sponsor-deals": "src/features/sponsors/components/EpisodeDeals.tsx",
  "publish-package": "src/features/publish/components/PublishSection.tsx",
  money: "src/features/economics/components/EpisodeMoney.tsx",
};
const partPages = Object.fromEntries(Object.entries(PART_MODULES).map(([part, module]) => [`${EPISODE}/${part}`, [SHELL, EPISODE_PAGE, module]]));

export const PAGE_MODULES: Record<string, string[]> = {
  "/sign-in": [auth("SignInPage")],
  "/sign-up": [auth("SignUpPage")],
  "/forgot-password": [auth("ForgotPasswordPage")],
  "/new-password/:token": [auth("NewPasswordPage")],
  "/verify/:token": [auth("VerifyEmailPage")],
  "/invite/:token": ["src/features/channels/components/AcceptInvitePage.tsx"],
  "/review/:token": ["src/features/sponsors/components/ReviewPage.tsx"],
  "/suggest/confirm/:token": ["src/features/intake/components/AddressLinkPage.tsx"],
  "/suggest/stop/:token": ["src/features/intake/components/AddressLinkPage.tsx"],
  "/suggest/:channelId": ["src/features/intake/components/SuggestPage.tsx"],
  "/sponsor-report/:token": ["src/features/sponsors/components/SponsorReportPage.tsx"],
  "/account": inShell("src/app/account-page.tsx"),
  "/channels/new": inShell("src/features/channels/components/NewChannelPage.tsx"),
  [`${CHANNEL}/home`]: inShell("src/features/home/components/HomePage.tsx"),
  [`${CHANNEL}/calendar`]: inShell("src/features/calendar/components/CalendarPage.tsx"),
  [`${CHANNEL}/slate`]: inShell("src/features/slate/components/SlatePage.tsx"),
  [`${CHANNEL}/slate/schedule`]: inShell("src/features/slate/components/StageLengthsPage.tsx"),
  // Before the page's own address, which Express would match first.
  ...partPages,
  [`${EPISODE}{/:part}`]: inShell(EPISODE_PAGE),
  [`${CHANNEL}/intake{/:ideaId}`]: inShell("src/features/intake/components/IntakePage.tsx"),
  [`${CHANNEL}/members`]: inShell("src/features/channels/components/MembersPage.tsx"),
  [`${CHANNEL}/shelf`]: inShell("src/features/bench/components/ShelfPage.tsx"),
  [`${CHANNEL}/shelf/:partId`]: inShell("src/features/bench/components/PartPage.tsx"),
  [`${CHANNEL}/rushes`]: inShell("src/features/rushes/components/RushesPage.tsx"),
  [`${CHANNEL}/shoot-days/:shootDayId`]: inShell("src/features/rushes/components/ShootDayPage.tsx"),
  [`${CHANNEL}/desk`]: inShell("src/features/sponsors/components/DeskPage.tsx"),
  [`${CHANNEL}/deals/:dealId/report`]: inShell("src/features/sponsors/components/ReportPage.tsx"),
  [`${CHANNEL}/sponsors`]: inShell("src/features/sponsors/components/SponsorsPage.tsx"),
  [`${CHANNEL}/money`]: inShell("src/features/economics/components/MoneyPage.tsx"),
};

/** One chunk of Vite's build manifest (`build.manifest`): its file and the chunks it imports statically. */
export interface ManifestChunk {
  file: string;
  isEntry?: boolean;
  imports?: string[];
  css?: string[];
}
export type Manifest = Record<string, ManifestChunk>;

/** The files a set of chunks loads before it runs: their own, their static imports', and their styles. */
function closure(manifest: Manifest, keys: string[]): { scripts: Set<string>; styles: Set<string> } {
  const scripts = new Set<string>();
  const styles = new Set<string>();
  const seen = new Set<string>();
  const visit = (key: string) => {
    const chunk = manifest[key];
    if (!chunk || seen.has(key)) return;
    seen.add(key);
    scripts.add(chunk.file);
    for (const css of chunk.css ?? []) styles.add(css);
    for (const imported of chunk.imports ?? []) visit(imported);
  };
  keys.forEach(visit);
  return { scripts, styles };
}

/**
 * index.html with the page's own code asked for in its head: a modulepreload per script and a
 * stylesheet per style the page needs that the app's entry does not already bring.
 */
export function withPagePreloads(html: string, manifest: Manifest, modules: string[]): string {
  const entries = Object.keys(manifest).filter((key) => manifest[key]!.isEntry);
  const already = closure(manifest, entries);
  const page = closure(manifest, modules);
  const links = [
    ...[...page.styles].filter((file) => !already.styles.has(file)).map((file) => `<link rel="stylesheet" crossorigin href="/${file}">`),
    ...[...page.scripts].filter((file) => !already.scripts.has(file)).map((file) => `<link rel="modulepreload" crossorigin href="/${file}">`),
  ];
  return links.length === 0 ? html : html.replace("</head>", `${links.join("")}</head>`);
}
