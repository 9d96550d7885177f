import { formatNumber } from "../core/format.js";
import { defineFormula } from "../core/formula.js";
import { POSITIVE } from "../core/spec.js";
import { staticLine } from "./microstrip.js";
import { CATEGORY, ellipticRatio, ETA0, STRIP_THICKNESS, SUBSTRATE_PERMITTIVITY } from "./shared.js";

const LN2 = Math.LN2;
const LN4 = 2 * Math.LN2;

/** ln cosh x for x >= 0 without overflow: x - ln 2 + log1p(e^-2x). */
const lnCosh = (x: number) => x - LN2 + Math.log1p(Math.exp(-2 * x));
/** -expm1(-x) = 1 - e^-x for x >= 0, exact near 0. */
const oneMinusExp = (x: number) => -Math.expm1(-x);

/**
 * Cohn's exact zero-thickness stripline, K(k)/K(k') with k = sech x, x = pi w / (2 b),
 * given through m = sech^2 x, mc = tanh^2 x and their logarithms (no underflow for
 * wide or narrow strips).
 */
function cohnRatio(x: number): number {
  const th = Math.tanh(x);
  const sech = 1 / Math.cosh(x);
  // ln tanh x = ln((1 - e^-2x)/(1 + e^-2x)) = ln(-expm1(-2x)) - log1p(e^-2x).
  const lnTanh = Math.log(oneMinusExp(2 * x)) - Math.log1p(Math.exp(-2 * x));
  return ellipticRatio(sech * sech, th * th, -2 * lnCosh(x), 2 * lnTanh);
}

/**
 * Wheeler's (1978) stripline impedance times sqrt(epsr)/30 (the logarithm), for
 * strip width w, thickness t and ground spacing b: his thickness-corrected width
 * w' and the closed form ln{1 + (4/(pi W))[8/(pi W) + sqrt((8/(pi W))^2 + 6.27)]}, W = w'/(b - t).
 */
function wheelerLog(w: number, t: number, b: number): number {
  const bt = b - t;
  let wr = w / bt;
  if (t > 0) {
    const x = t / b;
    const n = 2 / (1 + ((2 / 3) * x) / (1 - x));
    const q = (0.0796 * x) / (w / b + 1.1 * x);
    const r = x / (2 - x);
    wr += (x / (Math.PI * (1 - x))) * (1 - 0.5 * Math.log(r * r + Math.pow(q, n)));
  }
  const p = 8 / (Math.PI * wr);
  const a = p / 2;
  const s = p + Math.hypot(p, Math.sqrt(6.27));
  const term = a * s;
  return Number.isFinite(term) ? Math.log1p(term) : Math.log(a) + Math.log(s);
}

/**
 * Characteristic impedance of a centred stripline: a strip of width w and
 * thickness t midway between two ground planes b apart, in a dielectric epsr.
 *
 * Zero thickness, exact by conformal mapping (Cohn 1954):
 *   Z0 = (eta0 / (4 sqrt(epsr))) K(k)/K(k'), k = sech(pi w / (2 b)), k' = tanh(pi w / (2 b)).
 * Finite thickness: Cohn's value times the ratio of Wheeler's (1978) closed form
 * at thickness t to the same at t = 0 (Wheeler states 0.5 % for his form), so
 * the result is exact at t = 0 and carries Wheeler's thickness effect.
 * K(k)/K(k') through the library's complete elliptic integrals with the
 * complementary moduli from the geometry (exact for very wide and very narrow strips).
 *
 * @example
 * striplineImpedance({ width: quantity(0.25, "mm"), groundSpacing: quantity(0.6, "mm"), relativePermittivity: 4.4 }); // ≈ 46 ohm
 */
export const striplineImpedance = /* @__PURE__ */ defineFormula({
  id: "striplineImpedance",
  title: "Stripline characteristic impedance",
  category: CATEGORY,
  description:
    "Characteristic impedance of a strip centred between two ground planes in one dielectric: exact (Cohn 1954) for a thin strip, with Wheeler's (1978) thickness effect applied as a ratio.",
  equation: "Z0 = (eta0 / (4 sqrt(epsr))) K(k)/K(k'), k = sech(pi w / (2 b)); times Wheeler(t)/Wheeler(0) for t > 0",
  inputs: [
    { name: "width", dimension: "Length", description: "Width of the strip", domain: POSITIVE, example: 2.5e-4 },
    { name: "groundSpacing", dimension: "Length", description: "Distance between the two ground planes", domain: POSITIVE, example: 6e-4 },
    { name: "relativePermittivity", ...SUBSTRATE_PERMITTIVITY },
    { name: "thickness", ...STRIP_THICKNESS, example: 1.7e-5 },
  ],
  output: { dimension: "Resistance", description: "Characteristic impedance" },
  relations: [{ rule: "thickness < groundSpacing", holds: (x) => x.thickness < x.groundSpacing }],
  validity: [
    {
      code: "thick_strip",
      when: (x) => x.thickness > 0.25 * x.groundSpacing,
      measure: (x) => x.thickness / x.groundSpacing / 0.25,
      message: (x) =>
        `thickness is ${formatNumber(x.thickness / x.groundSpacing)} of the ground spacing; Wheeler's (1978) thickness correction is stated to 0.5 % for thin strips and was fitted for t/b up to about 0.25 (from memory)`,
    },
  ],
  source: [
    { authors: "S. B. Cohn", year: 1954, title: "Characteristic impedance of the shielded-strip transmission line, IRE Trans. Microwave Theory Tech. 2(2), pp. 52-57", locator: "eq. (1), zero-thickness strip (from memory)" },
    { authors: "H. A. Wheeler", year: 1978, title: "Transmission-line properties of a strip line between parallel planes, IEEE Trans. Microwave Theory Tech. 26(11), pp. 866-876", locator: "thickness-corrected width and closed form (from memory)" },
  ],
  compute: (x) => {
    const b = x.groundSpacing;
    const cohn = ((ETA0 / 4) * cohnRatio((Math.PI / 2) * (x.width / b))) / Math.sqrt(x.relativePermittivity);
    if (x.thickness === 0) return cohn;
    return cohn * (wheelerLog(x.width, x.thickness, b) / wheelerLog(x.width, 0, b));
  },
});

interface CpwX {
  readonly width: number;
  readonly gap: number;
  readonly height: number;
  readonly relativePermittivity: number;
  readonly backing: "none" | "grounded";
}

/** K(k0)/K(k0') of the air-filled CPW, k0 = w/(w + 2g) (Wen 1969). */
function cpwAirRatio(w: number, g: number): number {
  const s = w + 2 * g;
  const k = w / s;
  // 1 - k0^2 = 4 g (w + g) / (w + 2g)^2, formed without cancellation.
  const mc = ((4 * g) / s) * ((w + g) / s);
  return ellipticRatio(k * k, mc, 2 * (Math.log(w) - Math.log(s)), LN4 + Math.log(g) + Math.log(w + g) - 2 * Math.log(s));
}

/** K(k)/K(k') for k1 = sinh(A)/sinh(B) (finite substrate under a CPW, Simons 2001). */
function sinhRatio(A: number, B: number): number {
  const d = B - A;
  // k1 = e^(A-B) (1 - e^-2A)/(1 - e^-2B); 1 - k1 = (1 - e^-(B-A))(1 + e^-(A+B))/(1 - e^-2B).
  const lnK = -d + Math.log(oneMinusExp(2 * A)) - Math.log(oneMinusExp(2 * B));
  const k = Math.exp(lnK);
  const oneMinus = (oneMinusExp(d) * (1 + Math.exp(-(A + B)))) / oneMinusExp(2 * B);
  const lnOneMinus = Math.log(oneMinusExp(d)) + Math.log1p(Math.exp(-(A + B))) - Math.log(oneMinusExp(2 * B));
  return ellipticRatio(k * k, oneMinus * (1 + k), 2 * lnK, lnOneMinus + Math.log1p(k));
}

/** K(k)/K(k') for k3 = tanh(A)/tanh(B) (conductor-backed CPW, Simons 2001). */
function tanhRatio(A: number, B: number): number {
  const d = B - A;
  const lnK = Math.log(oneMinusExp(2 * A)) - Math.log1p(Math.exp(-2 * A)) - Math.log(oneMinusExp(2 * B)) + Math.log1p(Math.exp(-2 * B));
  const k = Math.exp(lnK);
  // 1 - k3 = sinh(B - A)/(cosh A sinh B) = 2 e^-2A (1 - e^-2(B-A)) / ((1 + e^-2A)(1 - e^-2B)).
  const lnOneMinus = LN2 - 2 * A + Math.log(oneMinusExp(2 * d)) - Math.log1p(Math.exp(-2 * A)) - Math.log(oneMinusExp(2 * B));
  const oneMinus = Math.exp(lnOneMinus);
  return ellipticRatio(k * k, oneMinus * (1 + k), 2 * lnK, lnOneMinus + Math.log1p(k));
}

/** Effective permittivity and impedance of a CPW (Simons 2001, zero metal thickness). */
function cpw(x: CpwX): [number, number] {
  const r0 = cpwAirRatio(x.width, x.gap); // K(k0)/K(k0')
  const A = (Math.PI * x.width) / (4 * x.height);
  const B = (Math.PI * (x.width / 2 + x.gap)) / (2 * x.height);
  const er = x.relativePermittivity;
  if (x.backing === "none") {
    // eps_eff = 1 + ((epsr - 1)/2) [K(k1)/K(k1')] [K(k0')/K(k0)]; Z0 = (eta0/4) K(k0')/K(k0) / sqrt(eps_eff).
    const ee = 1 + ((er - 1) / 2) * (sinhRatio(A, B) / r0);
    return [ee, ETA0 / 4 / r0 / Math.sqrt(ee)];
  }
  // Conductor-backed: q = [K(k3)/K(k3')] / [K(k0)/K(k0')];
  // eps_eff = (1 + epsr q)/(1 + q); Z0 = (eta0/2) / (sqrt(eps_eff) (K(k0)/K(k0') + K(k3)/K(k3'))).
  const r3 = tanhRatio(A, B);
  const q = r3 / r0;
  const ee = (1 + er * q) / (1 + q);
  return [ee, ETA0 / 2 / (Math.sqrt(ee) * (r0 + r3))];
}

const CPW_INPUTS = [
  { name: "width", dimension: "Length", description: "Width of the centre strip", domain: POSITIVE, example: 3e-4 },
  { name: "gap", dimension: "Length", description: "Gap between the centre strip and each coplanar ground", domain: POSITIVE, example: 1.5e-4 },
  { name: "height", dimension: "Length", description: "Thickness of the substrate", domain: POSITIVE, example: 5e-4 },
  { name: "relativePermittivity", ...SUBSTRATE_PERMITTIVITY },
  { name: "backing", choices: ["none", "grounded"], description: "Metal under the substrate: none, or a ground plane (conductor-backed)", default: "none", example: "none" },
] as const;

const CPW_VALIDITY = [
  {
    code: "backing_mode",
    when: (x: CpwX) => x.backing === "grounded" && x.width + 2 * x.gap > x.height,
    measure: (x: CpwX) => (x.width + 2 * x.gap) / x.height,
    message: (x: CpwX) =>
      `the slot span w + 2g is ${formatNumber((x.width + 2 * x.gap) / x.height)} times the substrate height; with a ground plane below, the line then behaves increasingly as a microstrip and the parallel-plate mode between the coplanar grounds and the backing is easily excited (common practice)`,
  },
] as const;

const SIMONS = {
  authors: "R. N. Simons",
  year: 2001,
  title: "Coplanar Waveguide Circuits, Components, and Systems (Wiley)",
  locator: "ch. 2, conventional CPW on a finite substrate and conductor-backed CPW, quasi-static conformal mapping (from memory)",
} as const;
const WEN = {
  authors: "C. P. Wen",
  year: 1969,
  title: "Coplanar waveguide: a surface strip transmission line suitable for nonreciprocal gyromagnetic device applications, IEEE Trans. Microwave Theory Tech. 17(12), pp. 1087-1090",
  locator: "K(k)/K(k') impedance, k = w/(w + 2g) (from memory)",
} as const;

/**
 * Characteristic impedance of a coplanar waveguide: a centre strip of width w
 * between two coplanar grounds, gaps g, on a substrate of height h (epsr), with
 * no metal below ("none") or a ground plane below ("grounded").
 *
 * Quasi-static conformal mapping, zero metal thickness, grounds wide:
 *   none:     Z0 = (eta0/4) K(k0')/K(k0) / sqrt(eps_eff), k0 = w/(w + 2g);
 *   grounded: Z0 = (eta0/2) / (sqrt(eps_eff) (K(k0)/K(k0') + K(k3)/K(k3'))), k3 = tanh(pi w/4h)/tanh(pi (w + 2g)/4h)
 * (Wen 1969; Simons 2001 for finite height and the conductor-backed form).
 *
 * @example
 * coplanarWaveguideImpedance({ width: quantity(0.3, "mm"), gap: quantity(0.15, "mm"), height: quantity(0.5, "mm"), relativePermittivity: 4.4 }); // ≈ 70 ohm
 */
export const coplanarWaveguideImpedance = /* @__PURE__ */ defineFormula({
  id: "coplanarWaveguideImpedance",
  title: "Coplanar waveguide characteristic impedance",
  category: CATEGORY,
  description:
    "Characteristic impedance of a coplanar waveguide on a finite substrate, with or without a ground plane below, by quasi-static conformal mapping (zero metal thickness, wide coplanar grounds).",
  equation: "Z0 = (eta0 / 4) K(k0')/K(k0) / sqrt(eps_eff), k0 = w/(w + 2g); grounded: Z0 = (eta0 / 2) / (sqrt(eps_eff) (K(k0)/K(k0') + K(k3)/K(k3')))",
  inputs: CPW_INPUTS,
  output: { dimension: "Resistance", description: "Characteristic impedance" },
  validity: CPW_VALIDITY,
  source: [WEN, SIMONS],
  compute: (x) => cpw(x)[1],
});

/**
 * Effective relative permittivity of a coplanar waveguide (see
 * coplanarWaveguideImpedance):
 *   none:     eps_eff = 1 + ((epsr - 1)/2) [K(k1)/K(k1')] [K(k0')/K(k0)], k1 = sinh(pi w/4h)/sinh(pi (w + 2g)/4h);
 *   grounded: eps_eff = (1 + epsr q)/(1 + q), q = [K(k3)/K(k3')] [K(k0')/K(k0)].
 *
 * @example
 * coplanarWaveguideEffectivePermittivity({ width: quantity(0.3, "mm"), gap: quantity(0.15, "mm"), height: quantity(0.5, "mm"), relativePermittivity: 4.4 }); // ≈ 2.6
 */
export const coplanarWaveguideEffectivePermittivity = /* @__PURE__ */ defineFormula({
  id: "coplanarWaveguideEffectivePermittivity",
  title: "Coplanar waveguide effective permittivity",
  category: CATEGORY,
  description:
    "Effective relative permittivity of a coplanar waveguide on a finite substrate, with or without a ground plane below (quasi-static conformal mapping, zero metal thickness).",
  equation: "eps_eff = 1 + ((epsr - 1)/2) [K(k1)/K(k1')] [K(k0')/K(k0)]; grounded: eps_eff = (1 + epsr q)/(1 + q)",
  inputs: CPW_INPUTS,
  output: { dimension: "Dimensionless", description: "Effective relative permittivity" },
  validity: CPW_VALIDITY,
  source: [WEN, SIMONS],
  compute: (x) => cpw(x)[0],
});

/** ln coth y for y > 0, stable for large y: log1p(e^-2y) - log1p(-e^-2y). */
const lnCoth = (y: number) => Math.log1p(Math.exp(-2 * y)) - Math.log1p(-Math.exp(-2 * y));

/**
 * Per-unit-length capacitances / eps0 of a coupled microstrip pair in the even
 * and odd modes (Garg & Bahl 1979), for substrate permittivity er.
 */
function coupledCapacitances(u: number, sh: number, er: number): [number, number] {
  const line = staticLine(u, 0, er);
  const cp = er * u; // parallel plate, / eps0
  // Cf = (sqrt(eps_eff)/(c Z0) - Cp)/2; / eps0: c eps0 = 1/eta0.
  const cf = 0.5 * ((ETA0 * Math.sqrt(line.ee0)) / line.z0 - cp);
  const a = Math.exp(-0.1 * Math.exp(2.33 - 2.53 * u));
  const cfe = (cf / (1 + (a / sh) * Math.tanh(8 * sh))) * Math.sqrt(er / line.ee0);
  const k = sh / (sh + 2 * u);
  const s = sh + 2 * u;
  // Cga / eps0 = K(k')/K(k), k = s/(s + 2w); 1 - k^2 = 4 w (s + w)/(s + 2w)^2.
  const mc = ((4 * u) / s) * ((sh + u) / s);
  const cga = 1 / ellipticRatio(k * k, mc, 2 * (Math.log(sh) - Math.log(s)), LN4 + Math.log(u) + Math.log(sh + u) - 2 * Math.log(s));
  const cgd = (er / Math.PI) * lnCoth((Math.PI * sh) / 4) + 0.65 * cf * ((0.02 * Math.sqrt(er)) / sh + 1 - 1 / (er * er));
  return [cp + cf + cfe, cp + cf + cga + cgd];
}

/**
 * Even- or odd-mode characteristic impedance of a pair of coupled microstrip
 * lines (two strips of width w, spacing s, on a substrate of height h, epsr).
 *
 * Garg & Bahl (1979): the mode capacitances per length split into parallel-plate,
 * fringe and gap parts, C_e = Cp + Cf + Cf', C_o = Cp + Cf + Cga + Cgd, with
 * Cf from the single microstrip (Hammerstad & Jensen 1980 here), Cga by
 * conformal mapping (K(k')/K(k), k = s/(s + 2w)) and Cgd a fit; then
 * Z = 1/(c sqrt(C C_air)), C_air the same with epsr = 1. Stated accuracy
 * about 3 % for 0.2 <= w/h <= 2, 0.05 <= s/h <= 2 (from memory). Zero strip thickness.
 * Against this library's moment-method solver (coupledLineImpedances) over that
 * range for epsr 2.2 to 9.8: even mode within 3.3 %, odd mode within 5.8 %, the
 * odd mode worst at the tightest gaps (measured; tests/interconnect/planar.test.ts).
 *
 * @example
 * coupledMicrostripImpedance({ width: quantity(0.3, "mm"), spacing: quantity(0.2, "mm"), height: quantity(0.2, "mm"), relativePermittivity: 4.4, mode: "odd" }); // ≈ 40 ohm
 */
export const coupledMicrostripImpedance = /* @__PURE__ */ defineFormula({
  id: "coupledMicrostripImpedance",
  title: "Coupled microstrip even- and odd-mode impedance",
  category: CATEGORY,
  description:
    "Even- or odd-mode characteristic impedance of two identical coupled microstrip lines by the capacitance model of Garg and Bahl (1979); zero strip thickness.",
  equation: "Z = 1 / (c sqrt(C C_air)), C_even = Cp + Cf + Cf', C_odd = Cp + Cf + Cga + Cgd",
  inputs: [
    { name: "width", dimension: "Length", description: "Width of each strip", domain: POSITIVE, example: 3e-4 },
    { name: "spacing", dimension: "Length", description: "Edge-to-edge gap between the strips", domain: POSITIVE, example: 2e-4 },
    { name: "height", dimension: "Length", description: "Thickness of the substrate", domain: POSITIVE, example: 2e-4 },
    { name: "relativePermittivity", ...SUBSTRATE_PERMITTIVITY },
    { name: "mode", choices: ["even", "odd"], description: "Even mode (both strips driven alike) or odd mode (driven opposite)", example: "odd" },
  ],
  output: { dimension: "Resistance", description: "Mode characteristic impedance" },
  validity: [
    {
      code: "fitted_range",
      when: (x) => {
        const u = x.width / x.height;
        const g = x.spacing / x.height;
        return u < 0.2 || u > 2 || g < 0.05 || g > 2;
      },
      measure: (x) => Math.max(0.2 / (x.width / x.height), x.width / x.height / 2, 0.05 / (x.spacing / x.height), x.spacing / x.height / 2),
      message: (x) =>
        `width/height = ${formatNumber(x.width / x.height)} and spacing/height = ${formatNumber(x.spacing / x.height)}; Garg and Bahl (1979) state about 3 % for 0.2 <= w/h <= 2 and 0.05 <= s/h <= 2 (from memory)`,
    },
  ],
  source: [
    { authors: "R. Garg, I. J. Bahl", year: 1979, title: "Characteristics of coupled microstriplines, IEEE Trans. Microwave Theory Tech. 27(7), pp. 700-705", locator: "even- and odd-mode capacitances (from memory)" },
    { authors: "E. Hammerstad, O. Jensen", year: 1980, title: "Accurate models for microstrip computer-aided design, IEEE MTT-S Digest, pp. 407-409", locator: "single-line Z0 and eps_eff for the fringe capacitance (from memory)" },
  ],
  compute: (x) => {
    const u = x.width / x.height;
    const sh = x.spacing / x.height;
    const c = coupledCapacitances(u, sh, x.relativePermittivity);
    const ca = coupledCapacitances(u, sh, 1);
    const i = x.mode === "even" ? 0 : 1;
    // Z = 1/(c eps0 sqrt(C C_air)/eps0^2... ) = eta0 / sqrt(c_r c_air) with capacitances in units of eps0.
    return ETA0 / Math.sqrt(c[i]! * ca[i]!);
  },
});
