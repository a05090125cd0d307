import path from "node:path";
import { defineConfig, type Plugin } from "vite";
import react from "@vitejs/plugin-react";
import tailwindcss from "@tailwindcss/vite";
import { compression } from "vite-plugin-compression2";

/**
 * The type's latin file (Work Sans, variable: every weight in one) is asked for with the page, not once
 * the stylesheet has been read and the first text laid out.
 */
function preloadFont(): Plugin {
  const wanted = /work-sans-latin-wght-normal-[\w-]+\.woff2$/;
  return {
    name: "kerf-preload-font",
    transformIndexHtml: {
      order: "post",
      handler: (_html, context) =>
        Object.keys(context.bundle ?? {})
          .filter((file) => wanted.test(file))
          .map((file) => ({ tag: "link", attrs: { rel: "preload", href: `/${file}`, as: "font", type: "font/woff2", crossorigin: "" }, injectTo: "head" as const })),
    },
  };
}

/**
 * react-router 7 publishes only its development files in its package exports, so a production build
 * would carry its development warnings (remix-run/react-router issues 12532 and 14753); the build takes
 * its production files instead.
 */
const reactRouterProduction = [
  { find: /^react-router$/, replacement: path.resolve(import.meta.dirname, "node_modules/react-router/dist/production/index.mjs") },
  { find: /^react-router\/dom$/, replacement: path.resolve(import.meta.dirname, "node_modules/react-router/dist/production/dom-export.mjs") },
];

export default defineConfig(({ command }) => ({
  // Every text file is also written brotli- and gzip-compressed; the server sends the smallest the browser takes.
  plugins: [react(), tailwindcss(), preloadFont(), compression({ algorithms: ["brotliCompress", "gzip"], threshold: 1024, logLevel: "silent" })],
  resolve: {
    alias: [{ find: "@shared", replacement: path.resolve(import.meta.dirname, "shared") }, ...(command === "build" ? reactRouterProduction : [])],
  },
  // The manifest tells the server which files each page's code is (server/http/page-preloads.ts).
  build: { outDir: "dist/client", emptyOutDir: true, chunkSizeWarningLimit: 900, manifest: true },
  server: {
    host: "127.0.0.1",
    port: 5173,
    proxy: { "/api": { target: process.env.KERF_API_URL ?? "http://127.0.0.1:3000", changeOrigin: false } },
  },
}));
