import { testEnv } from "./test-env";

export interface CaughtMail {
  id: string;
  subject: string;
  text: string;
  to: { address: string }[];
  date: string;
}

export async function mailTo(address: string): Promise<CaughtMail[]> {
  const response = await fetch(`${testEnv.mailWebUrl}/api/email`);
  const all = (await response.json()) as CaughtMail[];
  return all.filter((mail) => mail.to.some((to) => to.address.toLowerCase() === address.toLowerCase()));
}

/** Polls the mail stand-in's API until a message to `address` arrives. */
export async function waitForMail(address: string, options: { timeoutMs?: number; count?: number } = {}): Promise<CaughtMail> {
  const deadline = Date.now() + (options.timeoutMs ?? 15_000);
  const count = options.count ?? 1;
  for (;;) {
    const found = await mailTo(address);
    if (found.length >= count) return found[count - 1]!;
    if (Date.now() > deadline) throw new Error(`no mail to ${address} within ${options.timeoutMs ?? 15_000} ms`);
    await new Promise((r) => setTimeout(r, 250));
  }
}

export function linkIn(mail: CaughtMail, pattern: RegExp): string {
  const match = mail.text.match(pattern);
  if (!match) throw new Error(`no link matching ${pattern} in: ${mail.text}`);
  return match[0];
}
