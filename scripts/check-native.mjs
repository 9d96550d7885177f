// Checks that the platform binaries of the build tools (optional npm
// dependencies) were installed. npm skips an optional package silently when its
// download fails, and the build then fails later with a confusing message; this
// check lets .ci/run reinstall instead. Exit 1 names what is missing.
import { createRequire } from "node:module";

const require = createRequire(import.meta.url);
const tools = ["rollup", "esbuild", "rolldown"];
const missing = [];
for (const t of tools) {
  try {
    require(t);
  } catch (e) {
    missing.push(`${t}: ${String(e?.message ?? e).split("\n")[0]}`);
  }
}
if (missing.length > 0) {
  console.error(`platform binaries missing after install:\n  ${missing.join("\n  ")}`);
  process.exit(1);
}
