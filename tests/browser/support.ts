import path from "node:path";
import { expect, type Page } from "@playwright/test";
import pg from "pg";

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

export const PASSWORD = "a-long-enough-password";

/** A query straight against the test database, for what no page or route makes. */
export async function sql<T extends pg.QueryResultRow>(text: string, values: unknown[]): Promise<T[]> {
  const client = new pg.Client({ connectionString: process.env.KERF_E2E_DATABASE_URL });
  await client.connect();
  try {
    return (await client.query<T>(text, values)).rows;
  } finally {
    await client.end();
  }
}

export interface HostAndEpisode {
  host: { name: string; channel: string };
  episode: { title: string; question: string; origin: "idea" | "sponsor"; targetPublishDate?: string; stage: string };
}

/**
 * A new host with a channel (through the sign-up page) and one episode (through the slate's API; should
 * that route change shape, straight into the test database at the given stage instead).
 */
export async function hostWithEpisode(page: Page, { host, episode }: HostAndEpisode) {
  const email = uniqueEmail("host");
  await page.goto("/sign-up");
  await page.getByLabel("Your name").fill(host.name);
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill(PASSWORD);
  await page.getByLabel("Channel name").fill(host.channel);
  await page.getByRole("button", { name: "Create account and channel" }).click();
  await expect(page.getByRole("heading", { name: "Slate" })).toBeVisible();
  // The address confirmation has its own journey (accounts.spec.ts); here the host has done it.
  await sql("update users set email_verified_at = now() where email = $1", [email]);
  const channelId = /\/c\/([0-9a-f-]{36})\//.exec(page.url())![1]!;
  const csrfToken = (await (await page.request.get("/api/auth/me")).json()).csrfToken as string;
  const created = await page.request.post(`/api/channels/${channelId}/episodes`, {
    headers: { "x-csrf-token": csrfToken },
    data: { title: episode.title, question: episode.question, origin: episode.origin, originLink: "", whyWorthIt: "", ownerId: "", tags: [], budgetAmount: "", budgetCurrency: "", targetPublishDate: episode.targetPublishDate ?? "" },
  });
  const episodeId =
    created.status() === 201
      ? ((await created.json()).episode.id as string)
      : (
          await sql<{ id: string }>("insert into episodes (channel_id, title, question, stage, rank, target_publish_date) values ($1, $2, $3, $4, 'a0', $5) returning id", [
            channelId,
            episode.title,
            episode.question,
            episode.stage,
            episode.targetPublishDate ?? null,
          ])
        )[0]!.id;
  return { channelId, episodeId, csrfToken };
}
