import path from "node:path";
import { defineConfig } from "vite";
import react from "@vitejs/plugin-react";
import tailwindcss from "@tailwindcss/vite";

export default defineConfig({
  plugins: [react(), tailwindcss()],
  resolve: { alias: { "@shared": path.resolve(import.meta.dirname, "shared") } },
  build: { outDir: "dist/client", emptyOutDir: true, chunkSizeWarningLimit: 900 },
  server: {
    host: "127.0.0.1",
    port: 5173,
    proxy: { "/api": { target: process.env.KERF_API_URL ?? "http://127.0.0.1:3000", changeOrigin: false } },
  },
});
