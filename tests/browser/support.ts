import path from "node:path";
import type { Page } from "@playwright/test";

const shots = path.resolve(import.meta.dirname, "../../.kerf/test-output/screenshots");

/** Saves what the person sees at this step, kept as a test artifact. */
export async function snap(page: Page, name: string): Promise<void> {
  await page.screenshot({ path: path.join(shots, `${name}.png`), fullPage: true });
}

export function uniqueEmail(label: string): string {
  return `${label}-${Date.now().toString(36)}${Math.random().toString(36).slice(2, 6)}@example.com`;
}

export async function latestMailTo(address: string, timeoutMs = 15_000): Promise<{ text: string; subject: string }> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const all = (await (await fetch(`${process.env.KERF_TEST_MAIL_WEB_URL}/api/email`)).json()) as { text: string; subject: string; to: { address: string }[] }[];
    const mine = all.filter((m) => m.to.some((t) => t.address === address));
    if (mine.length > 0) return mine[mine.length - 1]!;
    if (Date.now() > deadline) throw new Error(`no mail to ${address}`);
    await new Promise((r) => setTimeout(r, 250));
  }
}
