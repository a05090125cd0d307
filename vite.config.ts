import path from "node:path";
import { defineConfig } from "vite";
import react from "@vitejs/plugin-react";
import tailwindcss from "@tailwindcss/vite";
import { compression } from "vite-plugin-compression2";

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
  plugins: [react(), tailwindcss(), compression({ algorithms: ["brotliCompress", "gzip"], threshold: 1024, logLevel: "silent" })],
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
