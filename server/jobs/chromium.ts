import { type Browser, chromium } from "playwright-core";

/**
 * Chromium (Debian's, through playwright-core) for jobs that draw: one browser per process, started on
 * the first use and reused; each job takes a context of its own. Never on a request's path.
 */
let browser: Promise<Browser> | null = null;

export function sharedBrowser(executablePath: string): Promise<Browser> {
  if (!browser) {
    const starting = chromium.launch({ executablePath, args: ["--disable-gpu", "--font-render-hinting=none"] });
    browser = starting.then(
      (started) => {
        started.on("disconnected", () => (browser = null));
        return started;
      },
      (error: unknown) => {
        browser = null;
        throw error;
      },
    );
  }
  return browser;
}

export async function closeSharedBrowser(): Promise<void> {
  const open = browser;
  browser = null;
  if (open) await (await open).close().catch(() => undefined);
}
