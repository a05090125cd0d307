import path from "node:path";
import { defineConfig } from "vite";
import react from "@vitejs/plugin-react";
import tailwindcss from "@tailwindcss/vite";
import { compression } from "vite-plugin-compression2";

export default defineConfig({
  // Every text file is also written brotli- and gzip-compressed; the server sends the smallest the browser takes.
  plugins: [react(), tailwindcss(), compression({ algorithms: ["brotliCompress", "gzip"], threshold: 1024, logLevel: "silent" })],
  resolve: { alias: { "@shared": path.resolve(import.meta.dirname, "shared") } },
  build: { outDir: "dist/client", emptyOutDir: true, chunkSizeWarningLimit: 900 },
  server: {
    host: "127.0.0.1",
    port: 5173,
    proxy: { "/api": { target: process.env.KERF_API_URL ?? "http://127.0.0.1:3000", changeOrigin: false } },
  },
});
