import js from "@eslint/js";
import globals from "globals";
import reactHooks from "eslint-plugin-react-hooks";
import tseslint from "typescript-eslint";

// One-way flow: src/ and server/ never import each other; shared/ imports neither.
const forbid = (groups, message) => ["error", { patterns: [{ group: groups, message }] }];
const formatOnce = "Dates, times, durations, sizes and money are written by src/lib/format.ts (formatDay, formatInstant, formatDuration, formatSize, formatMoney).";

export default tseslint.config(
  { ignores: ["dist/", "node_modules/", ".kerf/", "drizzle/", "test-results/", "playwright-report/"] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    languageOptions: { globals: { ...globals.node } },
    rules: {
      "@typescript-eslint/no-unused-vars": ["error", { argsIgnorePattern: "^_", varsIgnorePattern: "^_" }],
      "@typescript-eslint/no-non-null-assertion": "off",
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
