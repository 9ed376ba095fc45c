// @ts-check
import { defineConfig, passthroughImageService } from "astro/config";
import node from "@astrojs/node";
import react from "@astrojs/react";
import tailwindcss from "@tailwindcss/vite";

const host = process.env.HOST ?? "127.0.0.1";
const port = Number(process.env.PORT ?? 4321);

export default defineConfig({
  output: "server",
  // Separate build folders let several builds run side by side (tests, parallel work).
  outDir: process.env.GAVELWRIGHT_OUT_DIR ?? "./dist",
  cacheDir: process.env.GAVELWRIGHT_CACHE_DIR ?? "./node_modules/.astro",
  // Middleware mode: scripts/serve.mjs is the HTTP server (static files, then the app).
  adapter: node({ mode: "middleware" }),
  integrations: [react()],
  // No image processing: the app serves no user images, so no image library runs on the server
  // (see docs/security/dependency-review.md).
  image: { service: passthroughImageService() },
  vite: { plugins: [tailwindcss()] },
  server: { host, port },
  security: {
    allowedDomains: [
      { protocol: "http", hostname: "127.0.0.1" },
      { protocol: "http", hostname: "localhost" },
      ...(process.env.PUBLIC_HOSTNAME ? [{ protocol: "https", hostname: process.env.PUBLIC_HOSTNAME }] : []),
    ],
  },
});
