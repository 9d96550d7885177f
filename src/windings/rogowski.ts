import { MU0 } from "../constants/si.js";
import { defineFormula } from "../core/formula.js";
import { POSITIVE, TURNS } from "../core/spec.js";
import { logOfRatio } from "../math/ratios.js";
import { scaledProduct } from "../math/scaled.js";

const MU0_OVER_2PI = MU0 / (2 * Math.PI);

/**
 * Mutual inductance between a straight conductor and a Rogowski coil of rectangular section around it.
 *
 * M = mu0 N h ln(b / a) / (2 pi), M in H, N turns wound uniformly on a non-magnetic former of
 * inner radius a, outer radius b and height h (all m); the coil's output is e = M dI/dt.
 * Independent of where the conductor passes through the window, as long as the winding is
 * uniform and dense (Ampere's law).
 *
 * Accuracy: within 3 ulp (ln(b/a) by logOfRatio, kept to its digits when b is near a).
 *
 * Reference: D. A. Ward, J. La T. Exon, "Using Rogowski coils for transient current
 * measurements", Engineering Science and Education Journal 2(3) (1993) 105-113 (from memory).
 *
 * @example
 * rogowskiMutualInductance({ turns: 500, innerRadius: quantity(20, "mm"), outerRadius: quantity(30, "mm"), height: quantity(10, "mm") }); // ≈ 0.41 uH
 */
export const rogowskiMutualInductance = /* @__PURE__ */ defineFormula({
  id: "rogowskiMutualInductance",
  title: "Rogowski coil mutual inductance",
  category: "winding",
  description: "Mutual inductance between a conductor and a uniformly, densely wound Rogowski coil of rectangular cross-section on a non-magnetic former; the coil output is M dI/dt.",
  equation: "M = mu0 N h ln(b / a) / (2 pi)",
  inputs: [
    { name: "turns", ...TURNS, example: 500 },
    { name: "innerRadius", dimension: "Length", description: "Inner radius a of the former", domain: POSITIVE, example: 0.02 },
    { name: "outerRadius", dimension: "Length", description: "Outer radius b of the former", domain: POSITIVE, example: 0.03 },
    { name: "height", dimension: "Length", description: "Height h of the former (axial)", domain: POSITIVE, example: 0.01 },
  ],
  output: { dimension: "Inductance", description: "Mutual inductance" },
  relations: [{ rule: "innerRadius < outerRadius", holds: (x) => x.innerRadius < x.outerRadius }],
  source: { authors: "D. A. Ward, J. La T. Exon", year: 1993, title: "Using Rogowski coils for transient current measurements, Engineering Science and Education Journal 2(3), 105-113", locator: "mutual inductance of a rectangular-section coil (from memory)" },
  compute: (x) => scaledProduct([MU0_OVER_2PI, x.turns, x.height, logOfRatio(x.outerRadius, x.innerRadius)]),
});
