import { readdirSync } from "node:fs";
import js from "@eslint/js";
import globals from "globals";
import importX from "eslint-plugin-import-x";
import { createTypeScriptImportResolver } from "eslint-import-resolver-typescript";
import reactHooks from "eslint-plugin-react-hooks";
import tseslint from "typescript-eslint";

// One-way flow: src/ and server/ never import each other; shared/ imports neither.
const forbid = (groups, message) => ["error", { patterns: [{ group: groups, message }] }];
const formatOnce = "Dates, times, durations, sizes and money are written by src/lib/format.ts (formatDay, formatInstant, formatDuration, formatSize, formatMoney).";
const serverFormatOnce = "Dates and times the server writes for people (mails, board flags) are written by shared/fields/written-dates.ts (formatDay, formatInstantNamingZone), in the reader's zone.";
const dateMethods = ["toLocaleDateString", "toLocaleTimeString", "toDateString", "toTimeString", "toUTCString"];

/**
 * The server's folders that belong to no feature: every feature may use them, they use no feature.
 * Every other folder of server/ is a feature (auth, channels, slate, bench, …), found on disk so a
 * new one is covered the day it is made.
 */
export const serverCore = ["http", "db", "seams", "jobs", "mail", "storage"];
const foldersOf = (dir) =>
  readdirSync(new URL(dir, import.meta.url), { withFileTypes: true })
    .filter((entry) => entry.isDirectory())
    .map((entry) => entry.name);
const serverFeatures = foldersOf("./server/").filter((name) => !serverCore.includes(name));
const clientFeatures = foldersOf("./src/features/");

/*
 * The one pair of features that still lean on each other: sign-up makes the first channel and
 * accepting an invitation makes an account. They are the accounts core; folding them into one folder
 * waits for the security work on both to land. No other feature may join this list.
 */
const accountsPair = {
  auth: ["./channels/channels.repository.ts"],
  channels: ["./auth/auth.service.ts", "./auth/password.ts", "./auth/users.repository.ts"],
};

const coreOnly = [...serverCore.map((name) => `./${name}`), "./env.ts"];
const boundaries = [
  // A feature imports only itself and the core: never another feature, never the composition root.
  ...serverFeatures.map((name) => ({
    target: `./server/${name}`,
    from: "./server",
    except: [`./${name}`, ...coreOnly, ...(accountsPair[name] ?? [])],
    message: "A server feature imports no other feature: plug into a seam (server/seams/) that server/app.ts fills in.",
  })),
  // The core imports no feature: features are handed in by server/app.ts.
  ...serverCore.map((name) => ({
    target: `./server/${name}`,
    from: "./server",
    except: coreOnly,
    message: "The server's core folders import no feature: take what you need as an argument from server/app.ts.",
  })),
  ...clientFeatures.map((name) => ({
    target: `./src/features/${name}`,
    from: "./src/features",
    except: [`./${name}`],
    message: "A client feature imports no other feature: src/app/ composes them.",
  })),
  {
    target: ["./src/lib", "./src/components"],
    from: ["./src/features", "./src/app"],
    message: "src/lib and src/components know no feature.",
  },
  {
    target: "./shared",
    from: ["./src", "./server", "./dev-services", "./tests"],
    message: "shared/ is pure: it imports nothing else of the repo.",
  },
  {
    target: "./server",
    from: ["./dev-services", "./tests"],
    message: "The server never imports development services or tests.",
  },
];

export default tseslint.config(
  { ignores: ["dist/", "node_modules/", ".kerf/", "drizzle/", "test-results/", "playwright-report/"] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    languageOptions: { globals: { ...globals.node } },
    plugins: { "import-x": importX },
    settings: {
      // import-x reads the modules a file imports with these, to follow chains through them.
      "import-x/extensions": [".ts", ".tsx", ".js"],
      "import-x/parsers": { "@typescript-eslint/parser": [".ts", ".tsx"] },
      "import-x/resolver-next": [createTypeScriptImportResolver({ project: "./tsconfig.json" })],
    },
    rules: {
      "@typescript-eslint/no-unused-vars": ["error", { argsIgnorePattern: "^_", varsIgnorePattern: "^_" }],
      "@typescript-eslint/no-non-null-assertion": "off",
      // No module may reach itself again through its imports (type-only imports leave nothing at run time).
      "import-x/no-cycle": ["error", { ignoreExternal: true }],
      "import-x/no-restricted-paths": ["error", { zones: boundaries }],
      // What runs in production (server/, src/, shared/) imports only dependencies: test oracles such as
      // smpte-timecode and csv-parse are devDependencies and stay in tests and development services.
      "import-x/no-extraneous-dependencies": [
        "error",
        { devDependencies: ["tests/**", "dev-services/**", "**/*.test.{ts,tsx}", "*.config.{ts,js}", "eslint.config.js"], optionalDependencies: false, peerDependencies: false },
      ],
    },
  },
  {
    files: ["src/**/*.{ts,tsx}"],
    languageOptions: { globals: { ...globals.browser } },
    plugins: { "react-hooks": reactHooks },
    rules: {
      ...reactHooks.configs.recommended.rules,
      "no-restricted-imports": forbid(["**/server/**", "node:*"], "The client must not import server code or Node built-ins; share through shared/."),
    },
  },
  // One way to write dates, times and money: only src/lib/format.ts formats them (proved by src/lib/format.lint.test.ts).
  {
    files: ["src/**/*.{ts,tsx}"],
    ignores: ["src/lib/format.ts"],
    rules: {
      "no-restricted-properties": [
        "error",
        ...["toLocaleDateString", "toLocaleTimeString", "toLocaleString", "toDateString", "toTimeString", "toUTCString"].map((property) => ({ property, message: formatOnce })),
        ...["DateTimeFormat", "RelativeTimeFormat", "NumberFormat"].map((property) => ({ object: "Intl", property, message: formatOnce })),
      ],
      "no-restricted-syntax": [
        "error",
        { selector: "ImportDeclaration[source.value=/^date-fns/] > ImportSpecifier[imported.name=/^(format|lightFormat|intlFormat)/]", message: formatOnce },
        { selector: "ImportDeclaration[source.value=/^date-fns/] > ImportNamespaceSpecifier", message: formatOnce },
        { selector: "ImportDeclaration[source.value=/^@shared\\//] > ImportSpecifier[imported.name=/^(formatBytes|formatSeconds|formatStay)$/]", message: formatOnce },
        { selector: "ImportDeclaration[source.value=/written-dates$/]", message: formatOnce },
      ],
    },
  },
  // The same on the server: one module writes the dates and times of mails (proved by tests/unit/server-format.lint.test.ts).
  {
    files: ["server/**/*.ts"],
    rules: {
      "no-restricted-properties": [
        "error",
        ...dateMethods.map((property) => ({ property, message: serverFormatOnce })),
        ...["DateTimeFormat", "RelativeTimeFormat"].map((property) => ({ object: "Intl", property, message: serverFormatOnce })),
      ],
      "no-restricted-syntax": [
        "error",
        { selector: "ImportDeclaration[source.value=/^date-fns/] > ImportSpecifier[imported.name=/^(format|lightFormat|intlFormat)/]", message: serverFormatOnce },
        { selector: "ImportDeclaration[source.value=/^date-fns/] > ImportNamespaceSpecifier", message: serverFormatOnce },
      ],
    },
  },
  {
    files: ["server/**/*.ts"],
    rules: { "no-restricted-imports": forbid(["**/src/**", "react", "react-dom"], "The server must not import client code; share through shared/.") },
  },
  {
    files: ["shared/**/*.ts"],
    rules: {
      "no-restricted-imports": forbid(
        ["**/src/**", "**/server/**", "drizzle-orm", "drizzle-orm/*", "node:*", "react"],
        "shared/ is pure: no client, server, database or Node imports.",
      ),
    },
  },
);
