import { execFile } from "node:child_process";
import { readdirSync } from "node:fs";
import path from "node:path";
import { promisify } from "node:util";
import { describe, expect, it } from "vitest";

const root = path.resolve(import.meta.dirname, "../..");
const modulesOf = (folder: string) =>
  readdirSync(path.join(root, folder), { recursive: true, encoding: "utf8" })
    .filter((file) => file.endsWith(".ts") && !file.endsWith(".test.ts"))
    .map((file) => path.join(folder, file))
    .sort();

describe("every module loads on its own", () => {
  it("when each server and shared module is the first one imported, then none throws while loading (an import cycle would: ReferenceError)", async () => {
    const modules = [...modulesOf("server"), ...modulesOf("shared")];
    // Native ESM in a child process (vitest's own loader turns a cycle's ReferenceError into other errors or none).
    const { stdout } = await promisify(execFile)(process.execPath, ["--import", "tsx", "tests/support/fresh-modules/import-each.mjs", ...modules], {
      cwd: root,
      maxBuffer: 10 * 1024 * 1024,
    });
    const lines = stdout.trim().split("\n").map((line) => JSON.parse(line) as { file?: string; error?: string; imported?: number });
    expect(lines.filter((line) => line.error)).toEqual([]);
    expect(lines.at(-1)).toEqual({ imported: modules.length });
  }, 240_000);
});
