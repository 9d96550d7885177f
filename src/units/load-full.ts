// How the notebook binding gets a complete mathjs (expressions, matrices): a
// static import for bundlers and the source tree. The Node build replaces this
// module with load-full.node.ts, which requires mathjs on first use.
import { all, create, type MathJsInstance } from "mathjs";

/** A new complete mathjs instance. */
export function loadFullMath(): MathJsInstance {
  return create(all!, {});
}
