import { MU0 } from "../constants/si.js";
import { defineFormula } from "../core/formula.js";
import { formatNumber } from "../core/format.js";
import { AT_LEAST_ONE, NON_NEGATIVE, POSITIVE, RELATIVE_PERMEABILITY, TURNS } from "../core/spec.js";
import { cappedRatio, logOfRatio } from "../math/ratios.js";
import { Scaled, moderate, scaledProduct } from "../math/scaled.js";

const MCLYMAN = { authors: "C. W. T. McLyman", year: 2004, title: "Transformer and Inductor Design Handbook, 3rd ed." } as const;
const CORE_PERMEABILITY = { ...RELATIVE_PERMEABILITY, description: "Relative permeability of the core material (1 for air)" } as const;
const IEC_60205 = {
  authors: "IEC",
  year: 2016,
  title: "IEC 60205: Calculation of the effective parameters of magnetic piece parts",
  locator: "effective length l_e, area A_e; A_L = L / N^2 (edition year from memory)",
} as const;

const PATH_LENGTH = { dimension: "Length", description: "Effective magnetic path length of the core, l_e (excluding the gap)", domain: POSITIVE, example: 0.1 } as const;
const CORE_AREA = { dimension: "Area", description: "Effective cross-section of the core, A_e (the gap is taken to have the same area)", domain: POSITIVE, example: 1e-4 } as const;
const GAP_LENGTH = { dimension: "Length", description: "Total air-gap length along the path (0 for an ungapped core)", default: 0, domain: NON_NEGATIVE, example: 5e-4 } as const;

/** Gap larger than 1 % of sqrt(A): fringing raises L by roughly 5 % or more (McLyman's factor, typical windows). */
function fringingMatters(gap: number, area: number): boolean {
  return gap > 0.01 * Math.sqrt(area);
}
const FRINGING_WARNING = {
  code: "fringing",
  when: (x: { readonly gapLength: number; readonly area: number }) => fringingMatters(x.gapLength, x.area),
  // gap / width: past the threshold above 0.01.
  measure: (x: { readonly gapLength: number; readonly area: number }) => cappedRatio(x.gapLength, Math.sqrt(x.area)),
  message: (x: { readonly gapLength: number; readonly area: number }) =>
    // sqrt(area) / 100 is at least 2e-164: never zero.
    `the gap is ${formatNumber(cappedRatio(x.gapLength, Math.sqrt(x.area) / 100), 2)} % of the core's width (sqrt of its area); fringing flux ` +
    "around a gap longer than about 1 % of the width raises the inductance by roughly 5 % or more, which this result neglects: apply gapFringingFactor",
};

/**
 * The magnetic-circuit formulas that assume a core guide the flux along its path;
 * a relative permeability below 1 (a diamagnetic material) is no magnetic core.
 * The result then holds only for an evenly wound toroid, where the winding itself
 * confines the flux.
 */
const NOT_A_CORE_WARNING = {
  code: "not_a_magnetic_core",
  when: (x: { readonly relativePermeability: number }) => x.relativePermeability < 1,
  measure: (x: { readonly relativePermeability: number }) => cappedRatio(1, x.relativePermeability),
  message: (x: { readonly relativePermeability: number }) =>
    `relative permeability ${formatNumber(x.relativePermeability, 6)} is below 1 (diamagnetic): such a material does not guide flux along a core path, ` +
    "so this magnetic-circuit result holds only for an evenly wound toroid",
};

/**
 * g + l / mur as mantissa and exponent: l / mur can overflow or underflow where
 * the inductance or flux density it divides is still a double. One rounding in
 * the quotient, one in the sum (positive terms: no cancellation).
 */
function gapPlusCore(g: number, l: number, mur: number): Scaled {
  const q = Scaled.of(l).div(mur);
  return g === 0 ? q : Scaled.of(g).plus(q);
}

/**
 * Reluctance of a uniform section of a magnetic circuit.
 *
 * R = l / (mu0 * mur * A), with R in 1/H (A-turns per Wb), l the path length in m,
 * A the cross-section in m^2, mur the relative permeability, mu0 in H/m (CODATA 2022).
 *
 * Validity: uniform flux over the cross-section, linear (unsaturated) material.
 *
 * Accuracy: within 3 ulp for every input whose result is a double (measured by
 * tests/flux/extremes-accuracy.test.ts; within 4 ulp for every formula in this file).
 *
 * Reference: C. W. T. McLyman, Transformer and Inductor Design Handbook, 3rd ed. (2004), magnetic circuits (from memory).
 *
 * @example
 * reluctance({ length: quantity(1, "mm"), area: quantity(1, "cm^2") }); // ≈ 7.96e6 1/H (an air gap)
 */
export const reluctance = /* @__PURE__ */ defineFormula({
  id: "reluctance",
  title: "Reluctance of a core section or gap",
  category: "magnetic circuit",
  description: "Reluctance of a uniform section of magnetic path (core leg or air gap), the magnetic analogue of resistance.",
  equation: "R = l / (mu0 * mur * A)",
  inputs: [
    { name: "length", dimension: "Length", description: "Length of the section along the flux", domain: POSITIVE, example: 0.1 },
    { name: "area", dimension: "Area", description: "Cross-section of the section", domain: POSITIVE, example: 1e-4 },
    { name: "relativePermeability", ...RELATIVE_PERMEABILITY, description: "Relative permeability of the section's material (1 for air)" },
  ],
  output: { dimension: "Reluctance", description: "Reluctance (ampere-turns per weber)" },
  source: { ...MCLYMAN, locator: "magnetic circuits, reluctance (chapter not checked; from memory)" },
  compute: (x) =>
    moderate(x.length) && moderate(x.relativePermeability) && moderate(x.area)
      ? x.length / (MU0 * x.relativePermeability * x.area)
      : scaledProduct([x.length], [MU0, x.relativePermeability, x.area]),
});

/**
 * Inductance of a winding on a gapped core.
 *
 * L = F * mu0 * N^2 * A / (g + l / mur), with L in H, N turns, A the effective area
 * in m^2, g the gap in m, l the effective path length in m (IEC 60205 l_e), mur the
 * core's relative permeability and F the fringing factor (1 = none).
 *
 * Validity: linear core below saturation; the gap has the core's area (fringing
 * neglected unless F is given; warning when g > 1 % of sqrt(A)); leakage neglected;
 * warning below mur = 1, where the material does not guide the flux.
 *
 * Reference: C. W. T. McLyman, Transformer and Inductor Design Handbook, 3rd ed. (2004), ch. 8 (gapped inductors; chapter from memory).
 *
 * @example
 * gappedCoreInductance({ turns: 20, pathLength: quantity(100, "mm"), area: quantity(1, "cm^2"), relativePermeability: 2000, gapLength: quantity(0.5, "mm") }); // ≈ 91.4 uH
 */
export const gappedCoreInductance = /* @__PURE__ */ defineFormula({
  id: "gappedCoreInductance",
  title: "Inductance of a gapped core",
  category: "magnetic circuit",
  description: "Inductance of N turns on a core with an air gap, from the series reluctance of core and gap.",
  equation: "L = F * mu0 * N^2 * A / (g + l / mur)",
  inputs: [
    { name: "turns", ...TURNS },
    { name: "pathLength", ...PATH_LENGTH },
    { name: "area", ...CORE_AREA },
    { name: "relativePermeability", ...CORE_PERMEABILITY },
    { name: "gapLength", ...GAP_LENGTH },
    {
      name: "fringingFactor",
      dimension: "Dimensionless",
      description: "Fringing factor F (>= 1) multiplying the inductance; 1 neglects fringing (see gapFringingFactor)",
      default: 1,
      domain: AT_LEAST_ONE,
      example: 1,
    },
  ],
  output: { dimension: "Inductance", description: "Inductance of the winding" },
  validity: [{ ...FRINGING_WARNING, when: (x) => x.fringingFactor === 1 && fringingMatters(x.gapLength, x.area) }, NOT_A_CORE_WARNING],
  source: { ...MCLYMAN, locator: "ch. 8 (from memory), inductance of a gapped core, L = 0.4 pi N^2 A_c 1e-8 / (l_g + MPL / mu_m) in cgs units" },
  // l / mur goes smoothly to 0 as mur grows: no 1 - 1/mur style cancellation. Plain when every
  // input is moderate; otherwise scaled (N^2 and l / mur can leave the double range on their own).
  compute: (x) =>
    moderate(x.fringingFactor) && moderate(x.turns) && moderate(x.area) && moderate(x.gapLength) && moderate(x.pathLength) && moderate(x.relativePermeability)
      ? (x.fringingFactor * MU0 * x.turns * x.turns * x.area) / (x.gapLength + x.pathLength / x.relativePermeability)
      : Scaled.of(x.fringingFactor).times(MU0).times(x.turns).times(x.turns).times(x.area).div(gapPlusCore(x.gapLength, x.pathLength, x.relativePermeability)).toNumber(),
});

/**
 * Flux density in a gapped core carrying a winding current.
 *
 * B = mu0 * N * I / (g + l / mur), with B in T, N turns, I the current in A, g the gap
 * and l the effective path length in m, mur the core's relative permeability.
 * With the gap of the core's area, B does not depend on the area; the area sets the
 * fringing check.
 *
 * Optional saturationFluxDensity (T): when given (> 0) a warning is raised if |B| exceeds it.
 *
 * Warning below mur = 1, where the material does not guide the flux.
 *
 * Reference: C. W. T. McLyman, Transformer and Inductor Design Handbook, 3rd ed. (2004), ch. 8 (from memory).
 *
 * @example
 * coreFluxDensity({ turns: 20, current: quantity(10, "A"), pathLength: quantity(100, "mm"), area: quantity(1, "cm^2"), relativePermeability: 2000, gapLength: quantity(0.5, "mm") }); // ≈ 0.457 T
 */
export const coreFluxDensity = /* @__PURE__ */ defineFormula({
  id: "coreFluxDensity",
  title: "Flux density in a gapped core",
  category: "magnetic circuit",
  description: "Flux density set by a winding's ampere-turns in a core with an air gap (Ampere's law around the path).",
  equation: "B = mu0 * N * I / (g + l / mur)",
  inputs: [
    { name: "turns", ...TURNS },
    { name: "current", dimension: "Current", description: "Winding current (peak, for the peak flux density)", example: 10 },
    { name: "pathLength", ...PATH_LENGTH },
    { name: "area", ...CORE_AREA },
    { name: "relativePermeability", ...CORE_PERMEABILITY },
    { name: "gapLength", ...GAP_LENGTH },
    {
      name: "saturationFluxDensity",
      dimension: "FluxDensity",
      description: "Saturation flux density of the core material; 0 means not given (no check)",
      default: 0,
      domain: NON_NEGATIVE,
      example: 0.47,
    },
  ],
  output: { dimension: "FluxDensity", description: "Flux density in the core and gap" },
  validity: [
    {
      code: "saturation",
      when: (x, b) => x.saturationFluxDensity > 0 && Math.abs(b as number) >= x.saturationFluxDensity,
      measure: (x, b) => cappedRatio(Math.abs(b as number), x.saturationFluxDensity),
      message: (x, b) =>
        `flux density ${formatNumber(Math.abs(b as number), 3)} T reaches the given saturation flux density ${formatNumber(x.saturationFluxDensity, 3)} T: ` +
        "permeability collapses and the current rises steeply; enlarge the gap, the area or reduce the turns",
    },
    FRINGING_WARNING,
    NOT_A_CORE_WARNING,
  ],
  source: { ...MCLYMAN, locator: "ch. 8 (from memory), B = 0.4 pi N I 1e-4 / (l_g + MPL / mu_m) in cgs units" },
  compute: (x) => {
    if (moderate(x.turns) && moderate(x.current) && moderate(x.gapLength) && moderate(x.pathLength) && moderate(x.relativePermeability)) {
      return (MU0 * x.turns * x.current) / (x.gapLength + x.pathLength / x.relativePermeability);
    }
    if (x.current === 0) return 0;
    const b = Scaled.of(MU0).times(x.turns).times(x.current).div(gapPlusCore(x.gapLength, x.pathLength, x.relativePermeability));
    return b.toNumber(Math.sign(x.current));
  },
});

/**
 * Fringing-flux factor of an air gap (McLyman's correction).
 *
 * F = 1 + (g / sqrt(A)) * ln(2 G / g), with g the gap length in m, A the core
 * cross-section at the gap in m^2 and G the winding-window length in m (along the gapped leg).
 * Multiply the inductance computed without fringing by F (gappedCoreInductance's fringingFactor).
 *
 * Validity: an empirical estimate for gaps small against the pole width and the window.
 * Warning when g > 10 % of sqrt(A) or F > 1.5, where it should be checked by measurement
 * or a field solution (common practice).
 *
 * Reference: C. W. T. McLyman, Transformer and Inductor Design Handbook, 3rd ed. (2004), ch. 8, "Fringing Flux" (chapter from memory).
 *
 * @example
 * gapFringingFactor({ gapLength: quantity(0.5, "mm"), area: quantity(1, "cm^2"), windowLength: quantity(20, "mm") }); // ≈ 1.22
 */
export const gapFringingFactor = /* @__PURE__ */ defineFormula({
  id: "gapFringingFactor",
  title: "Gap fringing factor",
  category: "magnetic circuit",
  description: "Factor by which fringing flux around an air gap raises the inductance (McLyman's empirical correction).",
  equation: "F = 1 + (g / sqrt(A)) * ln(2 G / g)",
  inputs: [
    { name: "gapLength", dimension: "Length", description: "Gap length", domain: POSITIVE, example: 5e-4 },
    { name: "area", dimension: "Area", description: "Core cross-section at the gap", domain: POSITIVE, example: 1e-4 },
    { name: "windowLength", dimension: "Length", description: "Winding-window length G along the gapped leg", domain: POSITIVE, example: 0.02 },
  ],
  output: { dimension: "Dimensionless", description: "Fringing factor (>= 1)" },
  relations: [{ rule: "gapLength < 2 * windowLength", holds: (x) => x.gapLength < 2 * x.windowLength }],
  validity: [
    {
      code: "large_gap",
      when: (x, f) => x.gapLength > 0.1 * Math.sqrt(x.area) || (f as number) > 1.5,
      // The worse of the two ratios to their thresholds (> 1 when warned).
      measure: (x, f) => Math.max(cappedRatio(x.gapLength, 0.1 * Math.sqrt(x.area)), (f as number) / 1.5),
      message: (_x, f) =>
        `fringing factor ${formatNumber(f as number, 3)} with a gap above 10 % of the pole width or F above 1.5: ` +
        "the empirical correction is rough here; check by measurement or a field solution (common practice)",
    },
  ],
  source: { ...MCLYMAN, locator: "ch. 8 (from memory), Fringing Flux: F = 1 + (l_g / sqrt(A_c)) ln(2G / l_g)" },
  // ln(2G/g) from the exact difference near g = 2G (logOfRatio); the product is a positive addend,
  // scaled where g / sqrt(A) alone would overflow or underflow.
  compute: (x) => {
    const g = x.gapLength;
    const G = x.windowLength;
    // 2G overflows only for G above half the largest double; then ln(G / (g/2)), with g/2 exact for
    // g >= 2^-1021, or ln(G/g) + ln 2 where G/g is astronomically large (no cancellation).
    const ln = 2 * G <= Number.MAX_VALUE ? logOfRatio(2 * G, g) : g >= 2 ** -1021 ? logOfRatio(G, g / 2) : logOfRatio(G, g) + Math.LN2;
    if (moderate(g) && moderate(x.area)) return 1 + (g / Math.sqrt(x.area)) * ln;
    const addend = Scaled.of(g).times(ln).div(Scaled.of(x.area).sqrt());
    // Below 2^-60 the addend cannot move 1 (it may even underflow the doubles): F is 1.
    return addend.e < -60 ? 1 : 1 + addend.toNumber();
  },
});

/**
 * Inductance factor A_L of a (gapped) core from its effective parameters.
 *
 * A_L = mu0 * A_e / (g + l_e / mur), in H per turn squared (datasheets quote nH),
 * with A_e, l_e the IEC 60205 effective area (m^2) and length (m), g the gap in m.
 *
 * Warning below mur = 1, where the material does not guide the flux.
 *
 * Reference: IEC 60205 (effective parameters); C. W. T. McLyman (2004), ch. 8 (from memory).
 *
 * @example
 * inductanceFactor({ pathLength: quantity(100, "mm"), area: quantity(1, "cm^2"), relativePermeability: 2000, gapLength: quantity(0.5, "mm") }); // ≈ 228.5 nH
 */
export const inductanceFactor = /* @__PURE__ */ defineFormula({
  id: "inductanceFactor",
  title: "Inductance factor A_L of a core",
  category: "magnetic circuit",
  description: "Inductance per turn squared (A_L) of a core from its effective length and area, permeability and gap.",
  equation: "A_L = mu0 * A_e / (g + l_e / mur)",
  inputs: [
    { name: "pathLength", ...PATH_LENGTH },
    { name: "area", ...CORE_AREA },
    { name: "relativePermeability", ...CORE_PERMEABILITY },
    { name: "gapLength", ...GAP_LENGTH },
  ],
  output: { dimension: "Inductance", description: "Inductance factor A_L (H per turn squared)" },
  validity: [FRINGING_WARNING, NOT_A_CORE_WARNING],
  source: [IEC_60205, { ...MCLYMAN, locator: "ch. 8 (from memory)" }],
  compute: (x) =>
    moderate(x.area) && moderate(x.gapLength) && moderate(x.pathLength) && moderate(x.relativePermeability)
      ? (MU0 * x.area) / (x.gapLength + x.pathLength / x.relativePermeability)
      : Scaled.of(MU0).times(x.area).div(gapPlusCore(x.gapLength, x.pathLength, x.relativePermeability)).toNumber(),
});

/**
 * Inductance of a winding from the core's inductance factor.
 *
 * L = A_L * N^2, with L in H, A_L in H (per turn squared; a datasheet's "250 nH"), N turns.
 *
 * Validity: A_L is quoted at low flux density; it falls as the core nears saturation.
 *
 * Reference: IEC 60205; C. W. T. McLyman (2004), ch. 8 (from memory).
 *
 * @example
 * inductanceFromFactor({ inductanceFactor: quantity(250, "nH"), turns: 20 }); // ≈ 100 uH
 */
export const inductanceFromFactor = /* @__PURE__ */ defineFormula({
  id: "inductanceFromFactor",
  title: "Inductance from A_L and turns",
  category: "magnetic circuit",
  description: "Inductance of N turns on a core of given inductance factor A_L.",
  equation: "L = A_L * N^2",
  inputs: [
    { name: "inductanceFactor", dimension: "Inductance", description: "Inductance factor A_L of the core (inductance per turn squared)", domain: POSITIVE, example: 250e-9 },
    { name: "turns", ...TURNS },
  ],
  output: { dimension: "Inductance", description: "Inductance of the winding" },
  source: [IEC_60205, { ...MCLYMAN, locator: "ch. 8 (from memory)" }],
  compute: (x) =>
    moderate(x.inductanceFactor) && moderate(x.turns) ? x.inductanceFactor * x.turns * x.turns : scaledProduct([x.inductanceFactor, x.turns, x.turns]),
});
