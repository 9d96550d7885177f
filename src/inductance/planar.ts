import { MU0 } from "../constants/si.js";
import { defineFormula } from "../core/formula.js";
import { NON_NEGATIVE, POSITIVE, TURNS } from "../core/spec.js";
import { Scaled, exponentOf, ldexp, moderate } from "../math/scaled.js";

const MOHAN = {
  authors: "S. S. Mohan, M. del Mar Hershenson, S. P. Boyd, T. H. Lee",
  year: 1999,
  title: "Simple accurate expressions for planar spiral inductances, IEEE J. Solid-State Circuits 34(10), 1419-1424",
} as const;

// Coefficients from the paper's tables (values from memory, see the report):
// current-sheet expression c1..c4 (Table II); modified Wheeler K1, K2 (Table I).
const SHEET = {
  square: [1.27, 2.07, 0.18, 0.13],
  hexagonal: [1.09, 2.23, 0.0, 0.17],
  octagonal: [1.07, 2.29, 0.0, 0.19],
  circular: [1.0, 2.46, 0.0, 0.2],
} as const;
const WHEELER = {
  square: [2.34, 2.75],
  hexagonal: [2.33, 3.82],
  octagonal: [2.25, 3.55],
} as const;

const SPIRAL_INPUTS = [
  { name: "turns", ...TURNS, example: 5 },
  { name: "outerDiameter", dimension: "Length", description: "Outer diameter of the spiral (across flats for polygons)", domain: POSITIVE, example: 0.0004 },
  { name: "innerDiameter", dimension: "Length", description: "Inner diameter of the spiral (across flats for polygons)", domain: NON_NEGATIVE, example: 0.0002 },
] as const;

const SPIRAL_RELATIONS = [
  { rule: "innerDiameter < outerDiameter", holds: (x: { innerDiameter: number; outerDiameter: number }) => x.innerDiameter < x.outerDiameter },
];

const SINGLE_TURN = {
  code: "single_turn",
  when: (x: { turns: number }) => x.turns < 2,
  measure: (x: { turns: number }) => 2 / x.turns,
  message: "a single turn is not a spiral: the fitted expression does not apply; use loopInductance or the Neumann solver (mutualInductance, polylineSelfInductance)",
} as const;

/**
 * L = k n^2 d_avg g(rho) for a shape constant k and a dimensionless g of the
 * fill ratio rho = (dout - din)/(dout + din), d_avg = (dout + din)/2. Plain
 * while n and dout are moderate; otherwise both diameters are scaled by the
 * power of two that brings dout into [1, 2) (exact: din may underflow only
 * where it no longer changes the sum), and the product is scaled, so every
 * representable result is returned to a few ulp and the rest is `out_of_range`.
 */
function spiral(k: number, n: number, dout: number, din: number, g: (rho: number) => number): number {
  if (moderate(n) && moderate(dout)) {
    const sum = dout + din;
    return k * n * n * (sum / 2) * g((dout - din) / sum);
  }
  const s = -exponentOf(dout);
  const o = ldexp(dout, s);
  const i = ldexp(din, s);
  const sum = o + i;
  return Scaled.of(k).times(n).times(n).times(Scaled.of(sum / 2, -s)).times(g((o - i) / sum)).toNumber();
}

/**
 * Inductance of a planar spiral, current-sheet expression of Mohan et al. (1999).
 *
 * L = (mu0 n^2 d_avg c1 / 2) [ ln(c2/rho) + c3 rho + c4 rho^2 ], with n turns,
 * d_avg = (d_out + d_in)/2 the mean diameter in m, rho = (d_out - d_in)/(d_out + d_in)
 * the fill ratio and c1..c4 per layout shape (square, hexagonal, octagonal,
 * circular); L in H.
 *
 * The sides of the spiral are replaced by current sheets of uniform current
 * density. Stated accuracy: typical error 2-3 % against field-solver and
 * measured data, for spacing not exceeding three trace widths (s <= 3w); it
 * worsens for large spacing. Planar spirals on a substrate without a magnetic
 * layer; the substrate and a ground plane are neglected.
 *
 * Reference: Mohan, Hershenson, Boyd & Lee, IEEE JSSC 34(10) (1999), current-sheet
 * approximation and its coefficient table (coefficients from memory). Scaled for
 * extreme magnitudes: every representable result to a few ulp, `out_of_range`
 * beyond the double range or below the smallest subnormal (2^-1074; a subnormal result is returned).
 *
 * @example
 * planarSpiralInductance({ turns: 5, outerDiameter: quantity(400, "um"), innerDiameter: quantity(200, "um"), shape: "square" }); // ≈ 11.4 nH
 */
export const planarSpiralInductance = /* @__PURE__ */ defineFormula({
  id: "planarSpiralInductance",
  title: "Planar spiral inductance (current sheet)",
  category: "inductance",
  description: "Inductance of a square, hexagonal, octagonal or circular planar spiral from the current-sheet expression of Mohan et al. (1999); typical error 2-3 % for spacing up to three trace widths.",
  equation: "L = (mu0 n^2 d_avg c1 / 2) [ ln(c2/rho) + c3 rho + c4 rho^2 ]",
  inputs: [
    ...SPIRAL_INPUTS,
    { name: "shape", choices: ["square", "hexagonal", "octagonal", "circular"], description: "Layout shape of the spiral", default: "square", example: "square" },
  ],
  output: { dimension: "Inductance", description: "Self-inductance" },
  relations: SPIRAL_RELATIONS,
  validity: [SINGLE_TURN],
  source: { ...MOHAN, locator: "current-sheet expression and its coefficient table (coefficients from memory)" },
  compute: (x) => {
    const [c1, c2, c3, c4] = SHEET[x.shape];
    // ln(c2/rho) as ln(c2) - ln(rho): rho may be tiny (thin ring) without loss; every term is positive (c2 > 1, rho <= 1).
    return spiral(0.5 * MU0 * c1, x.turns, x.outerDiameter, x.innerDiameter, (rho) => Math.log(c2) - Math.log(rho) + c3 * rho + c4 * rho * rho);
  },
});

/**
 * Inductance of a planar spiral, modified Wheeler expression of Mohan et al. (1999).
 *
 * L = K1 mu0 n^2 d_avg / (1 + K2 rho), with n turns, d_avg = (d_out + d_in)/2 in m,
 * rho = (d_out - d_in)/(d_out + d_in) and K1, K2 per layout shape; L in H.
 *
 * A separate formula rather than a `method` choice of planarSpiralInductance:
 * the paper gives these coefficients for square, hexagonal and octagonal
 * layouts only (no circular), and each expression has its own accuracy
 * statement, so each keeps its own inputs, warnings and source.
 *
 * Stated accuracy: typical error 2-3 % (as the current-sheet expression), for
 * spacing not exceeding three trace widths.
 *
 * Reference: Mohan, Hershenson, Boyd & Lee, IEEE JSSC 34(10) (1999), modified
 * Wheeler formula and its coefficient table (coefficients from memory). Scaled for
 * extreme magnitudes: every representable result to a few ulp, `out_of_range`
 * beyond the double range or below the smallest subnormal (2^-1074; a subnormal result is returned).
 *
 * @example
 * modifiedWheelerSpiralInductance({ turns: 5, outerDiameter: quantity(400, "um"), innerDiameter: quantity(200, "um"), shape: "square" }); // ≈ 11.5 nH
 */
export const modifiedWheelerSpiralInductance = /* @__PURE__ */ defineFormula({
  id: "modifiedWheelerSpiralInductance",
  title: "Planar spiral inductance (modified Wheeler)",
  category: "inductance",
  description: "Inductance of a square, hexagonal or octagonal planar spiral from the modified Wheeler expression of Mohan et al. (1999); typical error 2-3 % for spacing up to three trace widths.",
  equation: "L = K1 mu0 n^2 d_avg / (1 + K2 rho)",
  inputs: [
    ...SPIRAL_INPUTS,
    { name: "shape", choices: ["square", "hexagonal", "octagonal"], description: "Layout shape of the spiral", default: "square", example: "square" },
  ],
  output: { dimension: "Inductance", description: "Self-inductance" },
  relations: SPIRAL_RELATIONS,
  validity: [SINGLE_TURN],
  source: { ...MOHAN, locator: "modified Wheeler expression and its coefficient table (coefficients from memory)" },
  compute: (x) => {
    const [k1, k2] = WHEELER[x.shape];
    return spiral(k1 * MU0, x.turns, x.outerDiameter, x.innerDiameter, (rho) => 1 / (1 + k2 * rho));
  },
});
