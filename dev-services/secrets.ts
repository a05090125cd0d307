import { randomBytes } from "node:crypto";
import { existsSync, mkdirSync, readFileSync, writeFileSync } from "node:fs";
import path from "node:path";
import { stateDir } from "./paths";
import { newSecretKey, newWebhookSecret } from "./payments/store";

/**
 * Development secrets are made once per checkout and kept in .kerf/dev-secrets.json (git-ignored),
 * so sessions, the payments stand-in's key and its webhook signing secret survive a restart. A real
 * deployment sets SESSION_SECRET and the PAYMENTS_* settings itself (see README).
 */
interface DevelopmentSecrets {
  sessionSecret: string;
  paymentsSecretKey: string;
  paymentsWebhookSecret: string;
}

export function developmentSecrets(): DevelopmentSecrets & { file: string } {
  const file = path.join(stateDir, "dev-secrets.json");
  const stored = existsSync(file) ? (JSON.parse(readFileSync(file, "utf8")) as Partial<DevelopmentSecrets>) : {};
  const secrets: DevelopmentSecrets = {
    sessionSecret: stored.sessionSecret ?? randomBytes(32).toString("base64url"),
    paymentsSecretKey: stored.paymentsSecretKey ?? newSecretKey(),
    paymentsWebhookSecret: stored.paymentsWebhookSecret ?? newWebhookSecret(),
  };
  if (JSON.stringify(stored) !== JSON.stringify(secrets)) {
    mkdirSync(stateDir, { recursive: true });
    writeFileSync(file, JSON.stringify(secrets, null, 2), { mode: 0o600 });
  }
  return { ...secrets, file };
}
