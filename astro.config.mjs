// @ts-check
import { defineConfig } from "astro/config";
import node from "@astrojs/node";
import react from "@astrojs/react";
import tailwindcss from "@tailwindcss/vite";
import auth from "auth-astro";

// Astro ignores the Host header unless it is listed here, which would make every form POST
// (Auth.js sign-in included) fail the origin check. PUBLIC_HOSTS adds a deployment's host names.
const extraHosts = (process.env.PUBLIC_HOSTS ?? "")
  .split(",")
  .map((h) => h.trim())
  .filter(Boolean);

export default defineConfig({
  output: "server",
  adapter: node({ mode: "standalone" }),
  integrations: [react(), auth()],
  server: { host: "127.0.0.1" },
  security: {
    checkOrigin: true,
    allowedDomains: [
      { hostname: "127.0.0.1" },
      { hostname: "localhost" },
      ...extraHosts.map((hostname) => ({ hostname })),
    ],
  },
  vite: {
    // Tailwind brings its own copy of the vite types; the plugin itself is compatible.
    plugins: [/** @type {any} */ (tailwindcss())],
    ssr: { external: ["@electric-sql/pglite", "mjml", "bcryptjs"] },
  },
  devToolbar: { enabled: false },
});
