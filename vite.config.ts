import { defineConfig } from "vite";
import react from "@vitejs/plugin-react";
import tailwindcss from "@tailwindcss/vite";

const apiTarget = `http://127.0.0.1:${process.env.PORT ?? 3000}`;

// The API keeps its own cookie session, so the Host header is passed through unchanged
// (changeOrigin false) and WebSocket upgrades / event streams are relayed as they are.
const apiProxy = {
  "/api": { target: apiTarget, changeOrigin: false, ws: true },
};

export default defineConfig({
  root: "web",
  plugins: [react(), tailwindcss()],
  build: {
    outDir: "../dist/web",
    emptyOutDir: true,
    // tests/bench/bundleSize.ts reads the manifest to find what the sign-in page loads first.
    manifest: true,
  },
  server: {
    host: "127.0.0.1",
    port: 5173,
    strictPort: true,
    proxy: apiProxy,
  },
  preview: {
    host: "127.0.0.1",
    port: 4173,
    proxy: apiProxy,
  },
});
