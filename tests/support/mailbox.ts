import { expect } from "vitest";
import { testEnv } from "./test-env";

export interface CaughtMail {
  id: string;
  subject: string;
  text: string;
  to: { address: string }[];
  date: string;
}

/** What a mail stand-in holds for `address`: the shared one `npm test` starts, or a test's own. */
export async function mailTo(address: string, webUrl: string = testEnv.mailWebUrl): Promise<CaughtMail[]> {
  const response = await fetch(`${webUrl}/api/email`);
  const all = (await response.json()) as CaughtMail[];
  return all.filter((mail) => mail.to.some((to) => to.address.toLowerCase() === address.toLowerCase()));
}

/** Waits until the mail stand-in holds `count` messages to `address` (at least), and answers the last of them. */
export async function waitForMail(address: string, options: { timeoutMs?: number; count?: number; webUrl?: string } = {}): Promise<CaughtMail> {
  const count = options.count ?? 1;
  let found: CaughtMail[] = [];
  await expect
    .poll(async () => (found = await mailTo(address, options.webUrl)).length, { timeout: options.timeoutMs ?? 15_000, interval: 250, message: `mail to ${address}` })
    .toBeGreaterThanOrEqual(count);
  return found[count - 1]!;
}

export function linkIn(mail: CaughtMail, pattern: RegExp): string {
  const match = mail.text.match(pattern);
  if (!match) throw new Error(`no link matching ${pattern} in: ${mail.text}`);
  return match[0];
}
