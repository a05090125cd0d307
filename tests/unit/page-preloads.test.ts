import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { type Manifest, PAGE_MODULES, withPagePreloads } from "../../server/http/page-preloads";

const root = path.resolve(import.meta.dirname, "../..");

/** The modules src/app/router.tsx loads lazily, as paths from the repository's root. */
function routerModules(): string[] {
  const source = readFileSync(path.join(root, "src/app/router.tsx"), "utf8");
  return [...source.matchAll(/import\("([^"]+)"\)/g)].map(([, relative]) => path.relative(root, path.resolve(root, "src/app", `${relative!}.tsx`)));
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

describe("a page's code named in its index.html", () => {
  it("names every page the router loads", () => {
    const named = new Set(Object.values(PAGE_MODULES).flat());
    expect(routerModules().filter((module) => !named.has(module))).toEqual([]);
  });

  it("lists the page's scripts that the entry does not already bring, each once, and links its styles", () => {
    const page = withPagePreloads(html, manifest, ["src/app/layouts/AppShell.tsx", "src/features/slate/components/SlatePage.tsx"]);
    const list = /<script type="application\/json" id="kerf-page-code">([^<]+)<\/script>/.exec(page)?.[1];
    expect((JSON.parse(list!) as string[]).sort()).toEqual(["/assets/AppShell-e.js", "/assets/Button-d.js", "/assets/SlatePage-f.js", "/assets/board-g.js"].sort());
    const links = [...page.matchAll(/<link rel="(\w+)" crossorigin href="([^"]+)">/g)].map(([, rel, href]) => `${rel} ${href}`);
    expect(links).toEqual(["stylesheet /assets/SlatePage-h.css"]);
    expect(page.indexOf("kerf-page-code")).toBeLessThan(page.indexOf("</head>"));
  });

  it("lists the app's start with every page when the build has it", () => {
    const withStart: Manifest = { ...manifest, "src/app/start.tsx": { file: "assets/start-s.js", imports: ["index.html", "_react-b.js"] } };
    const page = withPagePreloads(html, withStart, ["src/features/slate/components/SlatePage.tsx"]);
    expect(page).toContain('"/assets/start-s.js"');
  });

  it("leaves the page as it is for a module the build does not know", () => {
    expect(withPagePreloads(html, manifest, ["src/gone.tsx"])).toBe(html);
  });
});
