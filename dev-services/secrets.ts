import { randomBytes } from "node:crypto";
import { existsSync, mkdirSync, readFileSync, writeFileSync } from "node:fs";
import path from "node:path";
import { stateDir } from "./paths";

/**
 * Development secrets are made once per checkout and kept in .kerf/dev-secrets.json (git-ignored),
 * so sessions survive a restart. A real deployment sets SESSION_SECRET itself (see README).
 */
export function developmentSecrets(): { sessionSecret: string; file: string } {
  const file = path.join(stateDir, "dev-secrets.json");
  if (existsSync(file)) return { ...(JSON.parse(readFileSync(file, "utf8")) as { sessionSecret: string }), file };
  mkdirSync(stateDir, { recursive: true });
  const sessionSecret = randomBytes(32).toString("base64url");
  writeFileSync(file, JSON.stringify({ sessionSecret }, null, 2), { mode: 0o600 });
  return { sessionSecret, file };
}
