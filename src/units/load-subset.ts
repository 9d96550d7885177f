// How the unit parser gets its mathjs subset. This is the version for bundlers
// and the source tree: a static import, so a bundler includes the subset only in
// bundles that reach unit parsing. The Node build replaces this module with
// load-subset.node.ts (see tsup.config.ts), which loads a prebuilt file on
// first use so that `import "emquant"` never loads mathjs.
import { createSubsetMath, type UnitMath } from "./mathjs-subset.js";

/** A new instance of the unit-parsing subset of mathjs. */
export function loadSubsetMath(): UnitMath {
  return createSubsetMath();
}
