import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { type Manifest, PAGE_MODULES, PART_MODULES, withPagePreloads } from "../../server/http/page-preloads";

const root = path.resolve(import.meta.dirname, "../..");

/** The modules src/app/router.tsx loads lazily, as paths from the repository's root. */
function routerModules(): string[] {
  const source = readFileSync(path.join(root, "src/app/router.tsx"), "utf8");
  return [...source.matchAll(/import\("([^"]+)"\)/g)].map(([, relative]) => path.relative(root, path.resolve(root, "src/app", `${relative!}.tsx`)));
}

/** Each part src/app/episode-sections.tsx adds to the episode page, with the module it loads lazily. */
function episodeParts(): Record<string, string> {
  const source = readFileSync(path.join(root, "src/app/episode-sections.tsx"), "utf8");
  const parts = [...source.matchAll(/id: "([\w-]+)",[\s\S]*?import\("([^"]+)"\)/g)];
  return Object.fromEntries(parts.map(([, id, relative]) => [id, path.relative(root, path.resolve(root, "src/app", `${relative!}.tsx`))]));
}

const manifest: Manifest = {
  "index.html": { file: "assets/index-a.js", isEntry: true, imports: ["_react-b.js"], css: ["assets/index-c.css"] },
  "_react-b.js": { file: "assets/react-b.js" },
  "_Button-d.js": { file: "assets/Button-d.js", imports: ["_react-b.js"] },
  "src/app/layouts/AppShell.tsx": { file: "assets/AppShell-e.js", imports: ["index.html", "_Button-d.js"] },
  "src/features/slate/components/SlatePage.tsx": { file: "assets/SlatePage-f.js", imports: ["_Button-d.js", "_board-g.js"], css: ["assets/SlatePage-h.css"] },
  "_board-g.js": { file: "assets/board-g.js" },
};
const html = "<html><head><title>Kerf</title></head><body></body></html>";

describe("a page's code asked for with its index.html", () => {
  it("names every page the router loads", () => {
    const named = new Set(Object.values(PAGE_MODULES).flat());
    expect(routerModules().filter((module) => !named.has(module))).toEqual([]);
  });

  it("names every part of the episode page, with the code it loads", () => {
    const parts = episodeParts();
    expect(Object.keys(parts).length).toBeGreaterThan(5);
    expect(PART_MODULES).toEqual(parts);
  });

  it("asks for the page's scripts and styles that the entry does not already bring, each once", () => {
    const page = withPagePreloads(html, manifest, ["src/app/layouts/AppShell.tsx", "src/features/slate/components/SlatePage.tsx"]);
    const links = [...page.matchAll(/<link rel="(\w+)" crossorigin href="([^"]+)">/g)].map(([, rel, href]) => `${rel} ${href}`);
    expect(links.sort()).toEqual(
      ["modulepreload /assets/AppShell-e.js", "modulepreload /assets/Button-d.js", "modulepreload /assets/SlatePage-f.js", "modulepreload /assets/board-g.js", "stylesheet /assets/SlatePage-h.css"].sort(),
    );
    expect(page.indexOf("<link")).toBeLessThan(page.indexOf("</head>"));
  });

  it("leaves the page as it is for a module the build does not know", () => {
    expect(withPagePreloads(html, manifest, ["src/gone.tsx"])).toBe(html);
  });
});
