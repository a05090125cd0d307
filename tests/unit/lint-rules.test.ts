import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { ESLint } from "eslint";
import { afterAll, beforeAll, describe, expect, it } from "vitest";

/*
 * The repo's own lint configuration run over a small made-up tree, to show that it refuses what
 * DEVELOPERS.md says it refuses: an import cycle, a feature importing another (either side), the
 * server's core importing a feature, shared/ importing the rest. The zones are read relative to the
 * working directory, so the tree is linted from its own folder.
 */
const repo = path.resolve(import.meta.dirname, "../..");
const tree: Record<string, string> = {
  "tsconfig.json": JSON.stringify({ compilerOptions: { module: "ESNext", moduleResolution: "Bundler", strict: true, jsx: "react-jsx" } }),
  "server/slate/gates.ts": 'import { benchGates } from "../bench/bench.gates";\nexport const leaves = () => true;\nexport const all = [...benchGates];\n',
  "server/bench/bench.gates.ts": 'import { leaves } from "../slate/gates";\nexport const benchGates = [leaves];\n',
  "server/bench/fine.ts": 'import { AppError } from "../http/app-error";\nexport const fine = AppError;\n',
  "server/http/app-error.ts": "export class AppError extends Error {}\n",
  "server/http/guards.ts": 'import { benchGates } from "../bench/bench.gates";\nexport const guards = benchGates;\n',
  "shared/pure.ts": 'import { fine } from "../server/bench/fine";\nexport const pure = fine;\n',
  "src/features/slate/Board.tsx": 'import { Shelf } from "../bench/Shelf";\nexport const Board = Shelf;\n',
  "src/features/bench/Shelf.tsx": "export const Shelf = () => null;\n",
};

let dir: string;
let messages: { file: string; rule: string | null }[];

beforeAll(async () => {
  dir = mkdtempSync(path.join(os.tmpdir(), "kerf-lint-rules-"));
  for (const [file, text] of Object.entries(tree)) {
    mkdirSync(path.dirname(path.join(dir, file)), { recursive: true });
    writeFileSync(path.join(dir, file), text);
  }
  const previous = process.cwd();
  process.chdir(dir);
  try {
    const eslint = new ESLint({ cwd: dir, overrideConfigFile: path.join(repo, "eslint.config.js") });
    const results = await eslint.lintFiles(["server/**/*.ts", "shared/**/*.ts", "src/**/*.tsx"]);
    messages = results.flatMap((result) => result.messages.map((message) => ({ file: path.relative(dir, result.filePath), rule: message.ruleId })));
  } finally {
    process.chdir(previous);
  }
}, 120_000);
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const rulesOn = (file: string) => messages.filter((m) => m.file === file).map((m) => m.rule);

describe("the lint rules that keep imports one way", () => {
  it("when two modules import each other, then both imports are refused as a cycle", () => {
    expect(rulesOn("server/slate/gates.ts")).toContain("import-x/no-cycle");
    expect(rulesOn("server/bench/bench.gates.ts")).toContain("import-x/no-cycle");
  });

  it("when a feature imports another feature, on the server or the client, then it is refused", () => {
    expect(rulesOn("server/bench/bench.gates.ts")).toContain("import-x/no-restricted-paths");
    expect(rulesOn("src/features/slate/Board.tsx")).toContain("import-x/no-restricted-paths");
  });

  it("when the server's core imports a feature, or shared/ imports the server, then it is refused", () => {
    expect(rulesOn("server/http/guards.ts")).toContain("import-x/no-restricted-paths");
    expect(rulesOn("shared/pure.ts")).toContain("import-x/no-restricted-paths");
  });

  it("when a feature imports the core, then nothing is said", () => {
    expect(rulesOn("server/bench/fine.ts")).toEqual([]);
  });
});
