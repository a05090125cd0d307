import { freePort } from "../processes";

/** What the benchmarks share: the p-th percentile of sorted timings, and a signed-in client of a running Kerf. */
export const percentile = (sorted: number[], p: number) => sorted[Math.min(sorted.length - 1, Math.max(0, Math.ceil((p / 100) * sorted.length) - 1))] ?? 0;

/** A signed-in client as the benchmarks drive it: the cookies to send back and the CSRF token for writes. */
export interface SignedIn {
  cookie: string;
  csrf: string;
}

/** Every cookie an answer sets, as name → value (what a browser's cookie jar would keep). */
function keepCookies(jar: Map<string, string>, response: Response): void {
  for (const line of response.headers.getSetCookie()) {
    const pair = line.split(";")[0]!;
    const at = pair.indexOf("=");
    jar.set(pair.slice(0, at), pair.slice(at + 1));
  }
}

const cookieHeader = (jar: Map<string, string>) => [...jar].map(([name, value]) => `${name}=${value}`).join("; ");

/**
 * Signs in as a browser does: a first visit for the CSRF cookie and token, then the sign-in; every
 * cookie the answers set (the CSRF token's and the session's) is sent back.
 */
export async function signIn(appUrl: string, person: { email: string; password: string }): Promise<SignedIn> {
  const jar = new Map<string, string>();
  const me = await fetch(`${appUrl}/api/auth/me`);
  keepCookies(jar, me);
  const { csrfToken } = (await me.json()) as { csrfToken: string };
  const signed = await fetch(`${appUrl}/api/auth/sign-in`, {
    method: "POST",
    headers: { cookie: cookieHeader(jar), "content-type": "application/json", "x-csrf-token": csrfToken },
    body: JSON.stringify({ email: person.email, password: person.password }),
  });
  if (!signed.ok) throw new Error(`sign-in failed: ${signed.status} ${await signed.clone().text()}`);
  keepCookies(jar, signed);
  return { cookie: cookieHeader(jar), csrf: ((await signed.json()) as { csrfToken: string }).csrfToken };
}

/** Runs a benchmark's main, then its stops in reverse order whatever happened; exits 0 only if main finished. */
export async function runBench(name: string, main: () => Promise<void>, stops: (() => Promise<void> | void)[]): Promise<never> {
  let code = 1;
  try {
    await main();
    code = 0;
  } catch (error) {
    console.error(`[${name}] ${(error as Error).stack ?? error}`);
  } finally {
    for (const stop of stops.reverse()) await stop();
  }
  process.exit(code);
}

/**
 * The settings of a Kerf a benchmark starts that sends no mail and keeps no files: the mail server and
 * the storage endpoint are closed ports, and the storage key pair opens nothing.
 */
export async function offlineServerEnv(name: string, settings: { port: number; databaseUrl: string; clientDist: string }): Promise<NodeJS.ProcessEnv> {
  const appUrl = `http://127.0.0.1:${settings.port}`;
  return {
    ...process.env,
    NODE_ENV: "production",
    PORT: String(settings.port),
    APP_URL: appUrl,
    DATABASE_URL: settings.databaseUrl,
    SESSION_SECRET: `${name}-bench-secret-`.repeat(4),
    SMTP_PORT: String(await freePort()),
    S3_ENDPOINT: `http://127.0.0.1:${await freePort()}`,
    S3_ACCESS_KEY_ID: `${name}-bench-no-storage`,
    S3_SECRET_ACCESS_KEY: `${name}-bench-no-storage`,
    CLIENT_DIST: settings.clientDist,
  };
}
