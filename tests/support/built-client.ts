import { mkdtempSync, mkdirSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { brotliCompressSync, gzipSync } from "node:zlib";

// A built client as the build writes it: hashed assets beside their .br and .gz copies.
export function builtClient(): string {
  const dist = mkdtempSync(path.join(tmpdir(), "kerf-client-"));
  mkdirSync(path.join(dist, "assets"));
  writeFileSync(path.join(dist, "index.html"), '<!doctype html><html><head><title>Kerf</title><link rel="stylesheet" crossorigin href="/assets/index-css123.css"></head><body></body></html>');
  writeFileSync(path.join(dist, "assets", "index-css123.css"), ".kerf-opening{color:#fbf9f5}");
  const script = "console.log('kerf');\n".repeat(200);
  writeFileSync(path.join(dist, "assets", "index-abc123.js"), script);
  writeFileSync(path.join(dist, "assets", "index-abc123.js.br"), brotliCompressSync(script));
  writeFileSync(path.join(dist, "assets", "index-abc123.js.gz"), gzipSync(script));
  writeFileSync(path.join(dist, "favicon.svg"), "<svg xmlns='http://www.w3.org/2000/svg'/>");
  mkdirSync(path.join(dist, ".vite"));
  const manifest = {
    "index.html": { file: "assets/index-abc123.js", isEntry: true },
    "src/app/layouts/AppShell.tsx": { file: "assets/AppShell-def456.js", imports: ["index.html"] },
    "src/features/slate/components/SlatePage.tsx": { file: "assets/SlatePage-789abc.js", imports: ["index.html"] },
    "src/app/episode-page.tsx": { file: "assets/episode-page-1a2b3c.js", imports: ["index.html"] },
    "src/features/bench/components/TestPlanSheet.tsx": { file: "assets/TestPlanSheet-4d5e6f.js", imports: ["index.html"] },
  };
  writeFileSync(path.join(dist, ".vite", "manifest.json"), JSON.stringify(manifest));
  return dist;
}
