import path from "node:path";

export const repoRoot = path.resolve(import.meta.dirname, "..");
/** Everything a checkout makes for itself (clusters, secrets, mail, test output), git-ignored. */
export const stateDir = path.join(repoRoot, ".kerf");
