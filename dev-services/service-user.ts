import { execFileSync, spawnSync } from "node:child_process";
import { createHash } from "node:crypto";
import { chownSync, existsSync, lstatSync, mkdirSync, readlinkSync, rmSync, symlinkSync } from "node:fs";
import path from "node:path";

/**
 * Local services that refuse to run as root (PostgreSQL) or drop to their own user (Swift, memcached)
 * run as root under that Debian user, which must be able to enter every parent of their folder.
 */
export const isRoot = () => process.getuid?.() === 0;

export function idsOf(user: string): { uid: number; gid: number } {
  const uid = Number(execFileSync("id", ["-u", user], { encoding: "utf8" }));
  const gid = Number(execFileSync("id", ["-g", user], { encoding: "utf8" }));
  return { uid, gid };
}

function userCanEnter(user: string, dir: string): boolean {
  if (!isRoot()) return true;
  return spawnSync("runuser", ["-u", user, "--", "test", "-x", dir]).status === 0;
}

/**
 * Keeps a service's folder inside the checkout when its user can reach it; otherwise (a clone under a
 * private home folder) in /var/tmp, keyed by the checkout's path, linked back from .kerf/.
 */
export function reachableFolder(wanted: string, user: string, label: string): string {
  const parent = path.dirname(wanted);
  mkdirSync(parent, { recursive: true });
  if (existsSync(wanted) || isSymlink(wanted)) return isSymlink(wanted) ? path.resolve(parent, readlinkSync(wanted)) : wanted;
  if (userCanEnter(user, parent)) return wanted;
  const key = createHash("sha256").update(wanted).digest("hex").slice(0, 12);
  const outside = path.join("/var/tmp", `kerf-${label}-${key}-${path.basename(wanted)}`);
  console.log(`[${label}] ${parent} is closed to the ${user} user; keeping its folder in ${outside} (linked from ${wanted}).`);
  symlinkSync(outside, wanted);
  return outside;
}

/** Removes a folder made by reachableFolder, wherever it ended up. */
export function removeFolder(wanted: string): void {
  if (isSymlink(wanted)) rmSync(path.resolve(path.dirname(wanted), readlinkSync(wanted)), { recursive: true, force: true });
  rmSync(wanted, { recursive: true, force: true });
}

function isSymlink(file: string): boolean {
  try {
    return lstatSync(file).isSymbolicLink();
  } catch {
    return false;
  }
}

/** Hands files and folders (not what is inside them) to the service's user; without root they are ours already. */
export function giveTo(user: string, ...entries: string[]): void {
  if (!isRoot()) return;
  const { uid, gid } = idsOf(user);
  for (const entry of entries) chownSync(entry, uid, gid);
}
