// Node build of load-full.ts: mathjs is required on first use, so importing
// the package does not pay for loading it.
import { createRequire } from "node:module";
import type { MathJsInstance } from "mathjs";

/** A new complete mathjs instance. */
export function loadFullMath(): MathJsInstance {
  const require = createRequire(import.meta.url);
  const { all, create } = require("mathjs") as typeof import("mathjs");
  return create(all!, {});
}
