import { SPEED_OF_LIGHT } from "../constants/si.js";
import { formatNumber } from "../core/format.js";
import { defineFormula } from "../core/formula.js";
import { AT_LEAST_ONE, NON_NEGATIVE, POSITIVE } from "../core/spec.js";
import { acoshOfRatio, logOfRatio } from "../math/ratios.js";
import { ldexp, moderate, scaledProduct } from "../math/scaled.js";
import { CATEGORY, differenceAndSum, ETA0, logOnePlusRatio } from "./shared.js";

const ETA0_OVER_2PI = ETA0 / (2 * Math.PI);
const ETA0_OVER_PI = ETA0 / Math.PI;
const TWO_PI_OVER_C = (2 * Math.PI) / SPEED_OF_LIGHT;
const TWENTY_OVER_LN10 = 20 / Math.LN10;

const POZAR = { authors: "D. M. Pozar", year: 2012, title: "Microwave Engineering, 4th ed." } as const;

/** Relative permittivity of a dielectric filling the whole cross-section. */
const FILL_PERMITTIVITY = {
  dimension: "Dimensionless",
  description: "Relative permittivity of the dielectric filling the line (1 for air)",
  default: 1,
  domain: AT_LEAST_ONE,
  example: 2.25,
} as const;

/**
 * Characteristic impedance of a coaxial line.
 *
 * Z0 = (eta0 / (2 pi sqrt(epsr))) ln(b / a), with a the inner conductor's
 * radius and b the outer conductor's inner radius in m, epsr the dielectric's
 * relative permittivity, eta0 = mu0 c in ohm. Lossless TEM line: it equals
 * sqrt(L'/C') of coaxialInductance and coaxialCapacitance per unit length.
 * ln(b/a) through logOfRatio (log1p near b = a), so thin dielectrics keep
 * their digits.
 *
 * @example
 * coaxialImpedance({ innerRadius: quantity(1.52, "mm"), outerRadius: quantity(3.5, "mm") }); // ≈ 50.0 ohm
 */
export const coaxialImpedance = /* @__PURE__ */ defineFormula({
  id: "coaxialImpedance",
  title: "Coaxial line characteristic impedance",
  category: CATEGORY,
  description: "Characteristic impedance of a lossless coaxial line filled with one dielectric (TEM mode).",
  equation: "Z0 = eta0 ln(b / a) / (2 pi sqrt(epsr))",
  inputs: [
    { name: "innerRadius", dimension: "Length", description: "Radius of the inner conductor", domain: POSITIVE, example: 4.5e-4 },
    { name: "outerRadius", dimension: "Length", description: "Inner radius of the outer conductor (shield)", domain: POSITIVE, example: 1.47e-3 },
    { name: "relativePermittivity", ...FILL_PERMITTIVITY },
  ],
  output: { dimension: "Resistance", description: "Characteristic impedance" },
  relations: [{ rule: "innerRadius < outerRadius", holds: (x) => x.innerRadius < x.outerRadius }],
  source: { ...POZAR, locator: "Table 2.1 (coaxial line) and eq. (2.32) (from memory)" },
  // The logarithm is in [2^-53, 1500] and sqrt(epsr) >= 1: no overflow or underflow.
  compute: (x) => (ETA0_OVER_2PI * logOfRatio(x.outerRadius, x.innerRadius)) / Math.sqrt(x.relativePermittivity),
});

/**
 * Characteristic impedance of a two-wire line (two parallel round wires).
 *
 * Z0 = (eta0 / (pi sqrt(epsr))) acosh(D / (2a)), with a the wire radius and D
 * the centre-to-centre separation in m, epsr the relative permittivity of the
 * medium around the wires, eta0 = mu0 c in ohm. Exact for a lossless line in a
 * uniform medium, proximity effect included; it equals sqrt(L'/C') of
 * twoWireInductance and twoWireCapacitance. acosh(1 + s) is built from the
 * exact difference s = (D - 2a)/(2a), so nearly touching wires keep their digits.
 *
 * @example
 * twoWireImpedance({ wireRadius: quantity(0.5, "mm"), separation: quantity(5, "mm") }); // ≈ 272 ohm
 */
export const twoWireImpedance = /* @__PURE__ */ defineFormula({
  id: "twoWireImpedance",
  title: "Two-wire line characteristic impedance",
  category: CATEGORY,
  description: "Characteristic impedance of a lossless line of two parallel round wires of equal radius in a uniform dielectric.",
  equation: "Z0 = eta0 acosh(D / (2 a)) / (pi sqrt(epsr))",
  inputs: [
    { name: "wireRadius", dimension: "Length", description: "Radius of each wire", domain: POSITIVE, example: 5e-4 },
    { name: "separation", dimension: "Length", description: "Distance between the wire axes (centre to centre)", domain: POSITIVE, example: 5e-3 },
    { name: "relativePermittivity", ...FILL_PERMITTIVITY, example: 1 },
  ],
  output: { dimension: "Resistance", description: "Characteristic impedance" },
  relations: [{ rule: "wireRadius < separation / 2", holds: (x) => 2 * x.wireRadius < x.separation }],
  validity: [
    {
      code: "dielectric",
      when: (x) => x.relativePermittivity > 1,
      measure: (x) => x.relativePermittivity,
      message:
        "relativePermittivity is taken to fill all the space around the wires; for insulated wires in air the effective value lies between 1 and the insulation's and must be estimated separately (common practice)",
    },
  ],
  source: { ...POZAR, locator: "Table 2.1 (two-wire line) (from memory)" },
  compute: (x) => (ETA0_OVER_PI * acoshOfRatio(x.separation, 2 * x.wireRadius)) / Math.sqrt(x.relativePermittivity),
});

/**
 * Propagation delay of a length of line: t = l sqrt(eps_eff) / c, with l in m,
 * eps_eff the line's effective relative permittivity (epsr for a line filled
 * with one dielectric; microstripEffectivePermittivity for a microstrip),
 * c = 299 792 458 m/s, t in s.
 *
 * @example
 * propagationDelay({ length: quantity(10, "cm"), effectivePermittivity: 3.3 }); // ≈ 606 ps
 */
export const propagationDelay = /* @__PURE__ */ defineFormula({
  id: "propagationDelay",
  title: "Propagation delay of a line",
  category: CATEGORY,
  description: "Time a wave takes along a lossless TEM or quasi-TEM line of given length and effective permittivity.",
  equation: "t = l sqrt(eps_eff) / c",
  inputs: [
    { name: "length", dimension: "Length", description: "Length of the line", domain: POSITIVE, example: 0.1 },
    { name: "effectivePermittivity", dimension: "Dimensionless", description: "Effective relative permittivity of the line (1 for air)", default: 1, domain: AT_LEAST_ONE, example: 3.3 },
  ],
  output: { dimension: "Time", description: "Propagation delay" },
  source: { ...POZAR, locator: "sec. 2.1, phase velocity v = 1/sqrt(L'C') = c/sqrt(eps_eff) (from memory)" },
  // sqrt(eps_eff) is in [1, 2^512): the plain product only for a moderate length.
  compute: (x) => {
    const s = Math.sqrt(x.effectivePermittivity);
    return moderate(x.length) && s < 2 ** 150 ? (x.length * s) / SPEED_OF_LIGHT : scaledProduct([x.length, s], [SPEED_OF_LIGHT]);
  },
});

const LOAD_INPUTS = [
  { name: "loadResistance", dimension: "Resistance", description: "Resistance of the load at the end of the line (0 for a short circuit)", domain: NON_NEGATIVE, example: 75 },
  { name: "characteristicImpedance", dimension: "Resistance", description: "Characteristic impedance of the line", domain: POSITIVE, example: 50 },
] as const;

/**
 * Reflection coefficient of a resistive load on a lossless line:
 * Gamma = (R - Z0) / (R + Z0), with R the load resistance and Z0 the line's
 * characteristic impedance, both in ohm; -1 for a short circuit, 0 for a
 * matched load, tending to +1 for an open end. Within 1.5 ulp: R - Z0 is exact
 * near a match (Sterbenz lemma) and the pair is scaled by a power of two before
 * the sum could overflow.
 *
 * @example
 * reflectionCoefficient({ loadResistance: quantity(75, "ohm"), characteristicImpedance: quantity(50, "ohm") }); // 0.2
 */
export const reflectionCoefficient = /* @__PURE__ */ defineFormula({
  id: "reflectionCoefficient",
  title: "Reflection coefficient of a resistive load",
  category: CATEGORY,
  description: "Voltage reflection coefficient at a resistive load terminating a lossless line.",
  equation: "Gamma = (R - Z0) / (R + Z0)",
  inputs: LOAD_INPUTS,
  output: { dimension: "Dimensionless", description: "Voltage reflection coefficient (-1 to 1)" },
  source: { ...POZAR, locator: "eq. (2.35) (from memory)" },
  compute: (x) => {
    const [d, s] = differenceAndSum(x.loadResistance, x.characteristicImpedance);
    return d / s;
  },
});

/**
 * Return loss of a resistive load on a lossless line, in dB:
 * RL = -20 log10 |Gamma| = 20 log10((R + Z0) / |R - Z0|). Positive; infinite
 * (out_of_range) for a perfect match. The difference is exact near a match,
 * so a load within 1e-12 of Z0 still gives its return loss to full precision.
 *
 * @example
 * returnLoss({ loadResistance: quantity(75, "ohm"), characteristicImpedance: quantity(50, "ohm") }); // ≈ 13.98 (dB)
 */
export const returnLoss = /* @__PURE__ */ defineFormula({
  id: "returnLoss",
  title: "Return loss of a resistive load",
  category: CATEGORY,
  description: "Return loss in dB of a resistive load terminating a lossless line; a matched load has infinite return loss (out_of_range).",
  equation: "RL = -20 log10 |(R - Z0) / (R + Z0)|  (dB)",
  inputs: LOAD_INPUTS,
  output: { dimension: "Dimensionless", description: "Return loss in dB" },
  source: { ...POZAR, locator: "eq. (2.39) (from memory)" },
  compute: (x) => {
    const [d] = differenceAndSum(x.loadResistance, x.characteristicImpedance);
    // (R + Z0)/|R - Z0| = 1 + 2 min(R, Z0)/|R - Z0|: the logarithm as ln(1 + ratio)
    // keeps its digits near 0 dB (a short or a huge mismatch) and never forms an
    // overflowing ratio near a match; 2 min(R, Z0) is exact, and scaled as d is.
    const big = x.loadResistance > 2 ** 1000 || x.characteristicImpedance > 2 ** 1000;
    const twiceMin = 2 * Math.min(big ? ldexp(x.loadResistance, -2) : x.loadResistance, big ? ldexp(x.characteristicImpedance, -2) : x.characteristicImpedance);
    return TWENTY_OVER_LN10 * logOnePlusRatio(twiceMin, Math.abs(d));
  },
});

/**
 * Voltage standing-wave ratio of a resistive load on a lossless line:
 * SWR = (1 + |Gamma|) / (1 - |Gamma|), which for a resistive load is exactly
 * max(R/Z0, Z0/R): one correctly rounded division, no cancellation as
 * |Gamma| -> 1. Infinite (out_of_range) for a short circuit.
 *
 * @example
 * standingWaveRatio({ loadResistance: quantity(75, "ohm"), characteristicImpedance: quantity(50, "ohm") }); // 1.5
 */
export const standingWaveRatio = /* @__PURE__ */ defineFormula({
  id: "standingWaveRatio",
  title: "Standing-wave ratio of a resistive load",
  category: CATEGORY,
  description: "Voltage standing-wave ratio on a lossless line terminated by a resistive load; a short circuit gives an infinite ratio (out_of_range).",
  equation: "SWR = (1 + |Gamma|) / (1 - |Gamma|) = max(R / Z0, Z0 / R)",
  inputs: LOAD_INPUTS,
  output: { dimension: "Dimensionless", description: "Voltage standing-wave ratio (at least 1)" },
  source: { ...POZAR, locator: "eq. (2.41) (from memory)" },
  compute: (x) =>
    x.loadResistance >= x.characteristicImpedance
      ? x.loadResistance / x.characteristicImpedance
      : x.characteristicImpedance / x.loadResistance,
});

/**
 * Input impedance of a lossless line of length l terminated by a resistive
 * load R, as [real, imaginary] components in ohm:
 *   Zin = Z0 (R + j Z0 tan(beta l)) / (Z0 + j R tan(beta l)),
 *   beta l = 2 pi f l sqrt(eps_eff) / c.
 * Written with r = R/Z0, s = sin(beta l), c = cos(beta l) as
 *   Re = Z0 r / (c^2 + r^2 s^2), Im = Z0 s c (1 - r)(1 + r) / (c^2 + r^2 s^2),
 * (for r > 1 the same with q = 1/r, divided through by r^2), which has no
 * tangent to blow up at a quarter wave and no cancellation near a match.
 *
 * @example
 * lineInputImpedance({ loadResistance: quantity(100, "ohm"), characteristicImpedance: quantity(50, "ohm"),
 *   length: quantity(2.5, "cm"), frequency: quantity(3, "GHz") }); // ≈ [25, 0] ohm (a quarter wave in air)
 */
export const lineInputImpedance = /* @__PURE__ */ defineFormula({
  id: "lineInputImpedance",
  title: "Input impedance of a terminated lossless line",
  category: CATEGORY,
  description:
    "Input impedance, as real and imaginary components, of a lossless line of given length terminated by a resistive load.",
  equation: "Zin = Z0 (R + j Z0 tan(beta l)) / (Z0 + j R tan(beta l)), beta l = 2 pi f l sqrt(eps_eff) / c",
  inputs: [
    ...LOAD_INPUTS,
    { name: "length", dimension: "Length", description: "Length of the line", domain: POSITIVE, example: 0.02 },
    { name: "frequency", dimension: "Frequency", description: "Frequency", domain: POSITIVE, example: 1e9 },
    { name: "effectivePermittivity", dimension: "Dimensionless", description: "Effective relative permittivity of the line (1 for air)", default: 1, domain: AT_LEAST_ONE, example: 1 },
  ],
  output: { dimension: "Resistance", description: "Input impedance", components: ["real", "imaginary"] },
  validity: [
    {
      code: "phase_precision",
      // Each input carries a relative rounding of 2^-53; the phase then carries beta l 2^-52 rad.
      when: (x) => electricalLength(x) > 1e9,
      measure: (x) => electricalLength(x),
      message: (x) =>
        `the line is ${formatNumber(electricalLength(x) / (2 * Math.PI))} wavelengths long; a relative uncertainty of 1e-9 in length, frequency or permittivity moves the phase by more than a radian, so the result depends on digits the inputs do not have`,
    },
  ],
  source: { ...POZAR, locator: "eq. (2.44) (from memory)" },
  compute: (x) => {
    const z0 = x.characteristicImpedance;
    const bl = electricalLength(x);
    const s = Math.sin(bl);
    const c = Math.cos(bl);
    if (s === 0) return [x.loadResistance, 0]; // beta l underflowed: no line
    const r = x.loadResistance / z0;
    if (r <= 1) {
      // Re = Z0 r / H^2, Im = Z0 (s/H)(c/H)(1 - r)(1 + r), H = hypot(c, r s) >= |c| > 0.
      const h = Math.hypot(c, r * s);
      return [scaledProduct([z0, r / h], [h]), scaledProduct([z0, s / h, c / h, (1 - r) * (1 + r)])];
    }
    // q = 1/r < 1: Re = Z0 q / H^2, Im = -Z0 (s/H)(c/H)(1 - q)(1 + q), H = hypot(q c, s) >= |s| > 0.
    const q = z0 / x.loadResistance;
    const h = Math.hypot(q * c, s);
    return [scaledProduct([z0, q / h], [h]), -scaledProduct([z0, s / h, c / h, (1 - q) * (1 + q)])];
  },
});

/** beta l = 2 pi f l sqrt(eps_eff) / c in rad (Infinity beyond the double range, which fails as out_of_range). */
function electricalLength(x: { length: number; frequency: number; effectivePermittivity: number }): number {
  return scaledProduct([TWO_PI_OVER_C, x.frequency, x.length, Math.sqrt(x.effectivePermittivity)]);
}
