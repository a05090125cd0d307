import type { ChildProcess } from "node:child_process";
import path from "node:path";
import { spawnTied, stopChild, waitForHttp } from "./processes";

/**
 * The local mail stand-in: maildev catches every message sent over SMTP, shows it in a web inbox
 * and serves it through its REST API (/api/email), which the tests read.
 */
export interface MailCatcher {
  smtpPort: number;
  webUrl: string;
  stop(): Promise<void>;
}

const maildevBin = path.resolve(import.meta.dirname, "../node_modules/maildev/dist/bin/maildev.js");

export async function startMailCatcher(options: { smtpPort: number; webPort: number }): Promise<MailCatcher> {
  const child: ChildProcess = spawnTied(
    process.execPath,
    [maildevBin, "--smtp", String(options.smtpPort), "--web", String(options.webPort), "--ip", "127.0.0.1", "--web-ip", "127.0.0.1", "--silent"],
    { stdio: ["ignore", "ignore", "inherit"] },
  );
  const webUrl = `http://127.0.0.1:${options.webPort}`;
  // A busy machine can take a while; one that never answers leaves no maildev behind.
  await waitForHttp(`${webUrl}/api/email`, 60_000).catch(async (error: unknown) => {
    await stopChild(child);
    throw error;
  });
  return { smtpPort: options.smtpPort, webUrl, stop: () => stopChild(child) };
}
