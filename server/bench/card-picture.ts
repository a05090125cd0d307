import { readFile } from "node:fs/promises";
import { createRequire } from "node:module";
import { CARD_HEIGHT, CARD_WIDTH } from "../../shared/bench/results-card";
import { sharedBrowser } from "../jobs/chromium";

// The results card's SVG turned into PNG by the jobs' shared Chromium, each card on a page of its own
// with the network shut. Why this way: docs/decisions/0011-results-card-drawn-as-svg.md.

let fontFaces: Promise<string> | null = null;

/** The app's own type (Work Sans, SIL Open Font License), embedded so the SVG draws the same anywhere. */
export function cardFontFaces(): Promise<string> {
  fontFaces ??= (async () => {
    const require = createRequire(import.meta.url);
    const faces = await Promise.all(
      [400, 600, 700].map(async (weight) => {
        const file = require.resolve(`@fontsource/work-sans/files/work-sans-latin-${weight}-normal.woff2`);
        const data = (await readFile(file)).toString("base64");
        return `@font-face{font-family:'Work Sans';font-weight:${weight};src:url(data:font/woff2;base64,${data}) format('woff2')}`;
      }),
    );
    return faces.join("");
  })();
  return fontFaces;
}

export async function svgToPng(svg: string, executablePath: string): Promise<Buffer> {
  const context = await (await sharedBrowser(executablePath)).newContext({ viewport: { width: CARD_WIDTH, height: CARD_HEIGHT }, deviceScaleFactor: 1 });
  try {
    // The card is self-contained: nothing it could name is fetched.
    await context.route("**/*", (route) => route.abort());
    const page = await context.newPage();
    await page.setContent(`<!doctype html><html><body style="margin:0">${svg}</body></html>`, { waitUntil: "load" });
    await page.evaluate(() => document.fonts.ready.then(() => undefined));
    return await page.screenshot({ type: "png", clip: { x: 0, y: 0, width: CARD_WIDTH, height: CARD_HEIGHT } });
  } finally {
    await context.close();
  }
}
