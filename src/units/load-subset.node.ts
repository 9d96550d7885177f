// Node build of load-subset.ts: the subset is prebuilt into mathjs-subset.cjs
// beside this bundle and required on first use, synchronously, so `evaluate`
// stays synchronous and importing the package never loads mathjs.
import { createRequire } from "node:module";
import type { UnitMath } from "./mathjs-subset.js";

/** A new instance of the unit-parsing subset of mathjs. */
export function loadSubsetMath(): UnitMath {
  const require = createRequire(import.meta.url);
  return (require("./mathjs-subset.cjs") as { createSubsetMath: () => UnitMath }).createSubsetMath();
}
