import { expect, test, type Locator, type Page } from "@playwright/test";
import { demoChannelId, expectFitsPhone, signInToDemo, snap } from "./support";

/*
 * The owner sees every page of the channel, so theirs is the fullest top bar. From 768 px up the
 * channel, the finder and the account keep to one line, and the pages to one strip under it.
 */
let channelId: string;

test.beforeAll(async () => {
  channelId = await demoChannelId();
});

const middle = async (part: Locator) => {
  const box = (await part.boundingBox())!;
  return { top: box.y, middle: box.y + box.height / 2, bottom: box.y + box.height };
};

async function expectOneLine(page: Page, width: number) {
  const bar = page.getByRole("banner");
  const line = [
    bar.getByLabel("Channel", { exact: true }),
    bar.getByRole("searchbox", { name: "Find in this channel" }),
    bar.getByRole("link", { name: /^Your account/ }),
    bar.getByRole("button", { name: "Sign out" }),
  ];
  const [first, ...rest] = await Promise.all(line.map(middle));
  for (const part of rest) expect(Math.abs(part.middle - first!.middle), `${width} px: the bar's parts share one line`).toBeLessThan(6);
  const pages = await Promise.all((await bar.getByRole("navigation", { name: "Channel pages" }).getByRole("link").all()).map(middle));
  expect(pages).toHaveLength(10);
  for (const link of pages) {
    expect(Math.abs(link.top - pages[0]!.top), `${width} px: the pages share one strip`).toBeLessThan(2);
    expect(link.top, `${width} px: the pages sit under the bar's line`).toBeGreaterThanOrEqual(Math.max(...[first!, ...rest].map((p) => p.bottom)));
  }
  expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(width);
}

test.use({ viewport: { width: 1280, height: 800 } });

test("the owner's bar keeps to one line and one strip of pages from 640 px up, and to the menu on a phone", async ({ page }) => {
  await signInToDemo(page, "owner", channelId);
  const pages = page.getByRole("navigation", { name: "Channel pages" });
  for (const width of [1440, 1280, 1024, 768, 700, 640]) {
    await page.setViewportSize({ width, height: 800 });
    await expectOneLine(page, width);
    await expect(pages.getByRole("link", { name: "Home" })).toHaveAttribute("aria-current", "page");
    await snap(page, `top-bar-${width}`);
  }

  // At the narrowest desk the finder's results open under the bar and stay on the screen.
  await page.keyboard.press("/");
  await page.keyboard.type("rocket");
  const finder = page.getByRole("search");
  await expect(finder.getByRole("status")).toHaveText(/results? for “rocket”/);
  const results = (await finder.getByRole("status").boundingBox())!;
  expect(results.x).toBeGreaterThanOrEqual(0);
  expect(results.x + results.width).toBeLessThanOrEqual(768);
  await snap(page, "top-bar-768-finding");
  await page.keyboard.press("Escape");
  await expect(finder.getByRole("status")).toBeHidden();

  // The keyboard goes from the channel to its pages, and the page followed is the one marked.
  await page.getByLabel("Channel", { exact: true }).focus();
  await page.keyboard.press("Tab");
  await expect(pages.getByRole("link", { name: "Home" })).toBeFocused();
  await pages.getByRole("link", { name: "Money" }).click();
  await expect(pages.getByRole("link", { name: "Money" })).toHaveAttribute("aria-current", "page");
  await expect(pages.getByRole("link", { name: "Home" })).not.toHaveAttribute("aria-current", "page");

  // A phone keeps the mark, the role and the menu; the sheet holds the rest.
  await page.setViewportSize({ width: 390, height: 844 });
  await expect(pages).toBeHidden();
  await expectFitsPhone(page, "top bar on a phone");
  await snap(page, "top-bar-390");
  await page.getByRole("button", { name: "Menu" }).click();
  await expect(pages.getByRole("link", { name: "Money" })).toHaveAttribute("aria-current", "page");
  await expectFitsPhone(page, "menu sheet on a phone");
  await snap(page, "top-bar-390-menu");
});
