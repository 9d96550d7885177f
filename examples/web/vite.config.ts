// The browser page: `npm run build:web` builds it to out/web (a static site).
// The library comes from src through the "emquant" alias, as a user's import would read.
import { resolve } from "node:path";
import { defineConfig } from "vite";

const here = import.meta.dirname;

export default defineConfig({
  root: here,
  base: "./",
  resolve: { alias: { emquant: resolve(here, "../../src/index.ts") } },
  worker: { format: "es" },
  build: { outDir: resolve(here, "../../out/web"), emptyOutDir: true, target: "es2022" },
});
