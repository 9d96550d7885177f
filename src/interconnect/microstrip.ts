import { SPEED_OF_LIGHT } from "../constants/si.js";
import { formatNumber } from "../core/format.js";
import { defineFormula } from "../core/formula.js";
import { NON_NEGATIVE, POSITIVE } from "../core/spec.js";
import { CATEGORY, ETA0, logOnePlusRatio, STRIP_THICKNESS, SUBSTRATE_PERMITTIVITY } from "./shared.js";

const HAMMERSTAD_JENSEN = {
  authors: "E. Hammerstad, O. Jensen",
  year: 1980,
  title: "Accurate models for microstrip computer-aided design, IEEE MTT-S International Microwave Symposium Digest, pp. 407-409",
  locator: "eqs. (1)-(6) quasi-static impedance and effective permittivity, eqs. (7)-(10) strip thickness correction (equation numbers from memory)",
} as const;
const KIRSCHNING_JANSEN = {
  authors: "M. Kirschning, R. H. Jansen",
  year: 1982,
  title: "Accurate model for effective dielectric constant of microstrip with validity up to millimetre-wave frequencies, Electronics Letters 18(6), pp. 272-273",
  locator: "eqs. (1)-(2), P1-P4 (equation numbers and coefficients from memory; not yet checked against a printed statement of the paper)",
} as const;
const JANSEN_KIRSCHNING = {
  authors: "R. H. Jansen, M. Kirschning",
  year: 1983,
  title: "Arguments and an accurate model for the power-current formulation of microstrip characteristic impedance, Archiv fuer Elektronik und Uebertragungstechnik (AEU) 37, pp. 108-112",
  locator: "frequency-dependent impedance, R1-R17 (coefficients from memory; not yet checked against a printed statement of the paper)",
} as const;

/** Z0 in air of a zero-thickness strip, times 2 pi / eta0: the logarithm in H&J eq. (1). */
function airLog(u: number): number {
  // f(u) = 6 + (2 pi - 6) exp(-(30.666/u)^0.7528); for tiny u the power is
  // Infinity and exp gives 0, which is the limit.
  const f = 6 + (2 * Math.PI - 6) * Math.exp(-Math.pow(30.666 / u, 0.7528));
  // ln(f/u + sqrt(1 + 4/u^2)) = ln(1 + (f + sqrt(u^2 + 4) - u)/u) with
  // sqrt(u^2 + 4) - u = 4/(sqrt(u^2 + 4) + u): no cancellation for wide
  // strips, no overflow of 4/u^2 for narrow ones (hypot, logOnePlusRatio).
  return logOnePlusRatio(f + 4 / (Math.hypot(u, 2) + u), u);
}

/** Z01(u): impedance in air of a zero-thickness strip of width/height u (H&J eq. 1), ohm. */
function airImpedance(u: number): number {
  return (ETA0 / (2 * Math.PI)) * airLog(u);
}

/** H&J eq. (4): a(u), the wide-strip exponent, written without overflow or log(0). */
function exponentA(u: number): number {
  // ln((u^4 + (u/52)^2) / (u^4 + 0.432)).
  let ln1: number;
  if (u < 1) {
    // = 2 ln u + ln(u^2 + 1/2704) - ln(u^4 + 0.432): no underflow to log(0).
    ln1 = 2 * Math.log(u) + Math.log(u * u + 1 / 2704) - Math.log(u * u * u * u + 0.432);
  } else if (u < 1e30) {
    // = log1p(((u/52)^2 - 0.432) / (u^4 + 0.432)): near 0 for wide strips.
    ln1 = Math.log1p(((u / 52) * (u / 52) - 0.432) / (u * u * u * u + 0.432));
  } else {
    // The 0.432 terms are below 1e-60 of the others: ln1 = log1p(1/(2704 u^2)) = 1/(2704 u^2).
    ln1 = 1 / 2704 / u / u;
  }
  const r = u / 18.1;
  // ln(1 + r^3) = 3 ln r + log1p(r^-3) once r^3 could overflow.
  const ln2 = r < 1e100 ? Math.log1p(r * r * r) : 3 * Math.log(r) + Math.log1p(1 / (r * r * r));
  return 1 + ln1 / 49 + ln2 / 18.7;
}

/** H&J eq. (5): b(epsr). */
function exponentB(er: number): number {
  return 0.564 * Math.pow((er - 0.9) / (er + 3), 0.053);
}

/** H&J eq. (3): quasi-static effective permittivity of a zero-thickness strip. */
function staticPermittivity(u: number, er: number): number {
  // (1 + 10/u)^(-ab) = exp(-ab ln(1 + 10/u)), the logarithm without overflow.
  const power = Math.exp(-exponentA(u) * exponentB(er) * logOnePlusRatio(10, u));
  return (er + 1) / 2 + ((er - 1) / 2) * power;
}

/** The H&J strip-thickness corrections: widths u1 (air) and ur (dielectric) for t = thickness/height. */
function correctedWidths(u: number, t: number, er: number): [number, number] {
  if (t === 0) return [u, u];
  // coth^2 sqrt(6.517 u) as 1 / tanh^2; tanh > 0 for u > 0.
  const th = Math.tanh(Math.sqrt(6.517 * u));
  // du1 = (t/pi) ln(1 + 4e/(t coth^2 sqrt(6.517u))) = (t/pi) ln(1 + 4e tanh^2 / t).
  const du1 = (t / Math.PI) * logOnePlusRatio(4 * Math.E * th * th, t);
  // dur = (1/2)(1 + sech sqrt(epsr - 1)) du1.
  const dur = 0.5 * (1 + 1 / Math.cosh(Math.sqrt(er - 1))) * du1;
  return [u + du1, u + dur];
}

interface StaticLine {
  /** Quasi-static impedance, ohm. */
  z0: number;
  /** Quasi-static effective permittivity. */
  ee0: number;
}

/** H&J quasi-static impedance and effective permittivity with the thickness correction. */
export function staticLine(u: number, t: number, er: number): StaticLine {
  const [u1, ur] = correctedWidths(u, t, er);
  const eer = staticPermittivity(ur, er);
  const zr = airImpedance(ur);
  // eps_eff = eps_eff(ur) (Z01(u1)/Z01(ur))^2; the log ratio avoids the eta0 products.
  const ratio = t === 0 ? 1 : airLog(u1) / airLog(ur);
  return { z0: zr / Math.sqrt(eer), ee0: eer * ratio * ratio };
}

/** The normalised frequency fn = f h in GHz mm (K&J), from SI f h in Hz m. */
function normalisedFrequency(frequency: number, height: number): number {
  // 1 GHz mm = 1e6 Hz m. Dividing each factor first keeps f h from overflowing.
  return (frequency / 1e9) * (height / 1e-3);
}

/** K&J (1982): effective permittivity at normalised frequency fn. */
function dispersivePermittivity(u: number, er: number, ee0: number, fn: number): number {
  if (fn === 0 || er === 1) return ee0;
  const p1 = 0.27488 + (0.6315 + 0.525 / Math.pow(1 + 0.0157 * fn, 20)) * u - 0.065683 * Math.exp(-8.7513 * u);
  const p2 = 0.33622 * (1 - Math.exp(-0.03442 * er));
  const p3 = 0.0363 * Math.exp(-4.6 * u) * (1 - Math.exp(-Math.pow(fn / 38.7, 4.97)));
  const p4 = 1 + 2.751 * (1 - Math.exp(-Math.pow(er / 15.916, 8)));
  const p = p1 * p2 * Math.pow((0.1844 + p3 * p4) * fn, 1.5763);
  // eps(f) = epsr - (epsr - eps(0)) / (1 + P); P = Infinity gives epsr, the limit.
  return er - (er - ee0) / (1 + p);
}

/** x^y / (1 + c x^y) for x >= 0, written so that an overflowing x^y gives the limit 1/c. */
function saturating(x: number, y: number, c: number): number {
  const p = Math.pow(x, y);
  return Number.isFinite(p) ? p / (1 + c * p) : 1 / c;
}

/** Jansen & Kirschning (1983): impedance at normalised frequency fn from the static values. */
function dispersiveImpedance(u: number, er: number, line: StaticLine, eef: number, fn: number): number {
  if (fn === 0 || er === 1) return line.z0;
  const r1 = 0.03891 * Math.pow(er, 1.4);
  const r2 = 0.267 * Math.pow(u, 7);
  const r3 = 4.766 * Math.exp(-3.228 * Math.pow(u, 0.641));
  const r4 = 0.016 + Math.pow(0.0514 * er, 4.524);
  const r5s = saturating(fn / 28.843, 12, 1.2992); // R5 / (1 + 1.2992 R5)
  const r6 = 22.2 * Math.pow(u, 1.92);
  const r7 = 1.206 - 0.3144 * Math.exp(-r1) * (1 - Math.exp(-r2));
  // R8: the product under exp is 0 * Infinity only when R3 underflows; its limit is 0 then.
  const r8arg = r3 === 0 ? 0 : 0.004625 * r3 * Math.pow(er, 1.674) * Math.pow(fn / 18.365, 2.745);
  const r8 = 1 + 1.275 * (1 - Math.exp(-r8arg));
  const e6 = Math.pow(er - 1, 6);
  const r9 = ((5.086 * r4 * r5s) / (0.3838 + 0.386 * r4)) * Math.exp(-r6) * (Number.isFinite(e6) ? e6 / (1 + 10 * e6) : 0.1);
  const r10 = 0.00044 * Math.pow(er, 2.136) + 0.0184;
  const r11 = saturating(fn / 19.47, 6, 0.0962); // (fn/19.47)^6 / (1 + 0.0962 (fn/19.47)^6)
  const r12 = 1 / (1 + 0.00245 * u * u);
  const r13 = 0.9408 * Math.pow(eef, r8) - 0.9603;
  const r14 = (0.9408 - r9) * Math.pow(line.ee0, r8) - 0.9603;
  const r15 = 0.707 * r10 * Math.pow(fn / 12.3, 1.097);
  const r16 = 1 + 0.0503 * er * er * r11 * (1 - Math.exp(-Math.pow(u / 15, 6)));
  const r17 = r7 * (1 - ((1.1241 * r12) / r16) * Math.exp(-0.026 * Math.pow(fn, 1.15656) - r15));
  return line.z0 * Math.pow(r13 / r14, r17);
}

/**
 * Below this substrate permittivity the frequency-dependent impedance is not taken from Jansen and
 * Kirschning's expression directly. Its factor (R13/R14)^R17 has R13 = 0.9408 eps_eff(f)^R8 - 0.9603
 * and R14 = (0.9408 - R9) eps_eff(0)^R8 - 0.9603, which pass through zero where eps_eff^R8 is near
 * 0.9603/0.9408 = 1.0207: for substrates below about 1.05 the ratio is 0/0-like and swings wildly
 * (measured for w/h = 1 at f h = 39 GHz mm: 77 ohm at epsr 1.025, 223 ohm at 1.035, against 125 ohm
 * quasi-static) or is negative (NaN). From 1.1 up, R14 > 0.03 for every width and the ratio is regular.
 */
const NEAR_AIR = 1.1;

/**
 * The frequency-dependent impedance. For 1 < epsr < 1.1 (see NEAR_AIR) the logarithm of Jansen and
 * Kirschning's frequency factor at epsr = 1.1 is scaled by (epsr - 1)/0.1: continuous at 1.1, and
 * exact at epsr = 1, where a line in one medium has no dispersion. That interpolation is ours, not a
 * published model (the near_air_substrate warning says so).
 */
function impedanceAt(u: number, t: number, er: number, line: StaticLine, fn: number): number {
  if (er >= NEAR_AIR || er === 1) return dispersiveImpedance(u, er, line, dispersivePermittivity(u, er, line.ee0, fn), fn);
  const ref = staticLine(u, t, NEAR_AIR);
  const factor = dispersiveImpedance(u, NEAR_AIR, ref, dispersivePermittivity(u, NEAR_AIR, ref.ee0, fn), fn) / ref.z0;
  return line.z0 * Math.exp((Math.log(factor) * (er - 1)) / (NEAR_AIR - 1));
}

const INPUTS = [
  { name: "width", dimension: "Length", description: "Width of the strip", domain: POSITIVE, example: 3e-4 },
  { name: "height", dimension: "Length", description: "Thickness of the substrate between the strip and the ground plane", domain: POSITIVE, example: 1.6e-4 },
  { name: "relativePermittivity", ...SUBSTRATE_PERMITTIVITY },
  { name: "thickness", ...STRIP_THICKNESS },
  {
    name: "frequency", dimension: "Frequency", description: "Frequency (0 for the quasi-static value)",
    default: 0, domain: NON_NEGATIVE, example: 1e9,
  },
] as const;

/**
 * Below w/h = 1e-6 Hammerstad and Jensen's exponent a(u) heads for zero (it
 * turns negative near 5.6e-10, and eps_eff then leaves [(epsr+1)/2, epsr]):
 * a wrong number, so such a strip is refused rather than warned about. Their
 * stated range starts at w/h = 0.01 (warned from there down).
 */
const NARROW_LIMIT = 1e-6;
const NOT_TOO_NARROW = [
  { rule: "width >= 1e-6 height (Hammerstad and Jensen's fit fails for narrower strips)", holds: (x: MicrostripInputs) => x.width / x.height >= NARROW_LIMIT },
];

interface MicrostripInputs {
  readonly width: number;
  readonly height: number;
  readonly relativePermittivity: number;
  readonly thickness: number;
  readonly frequency: number;
}

/** h / lambda0 = f h / c: the electrical height of the substrate. */
const electricalHeight = (x: MicrostripInputs) => (x.frequency / SPEED_OF_LIGHT) * x.height;

/** Validity notes shared by the impedance and the effective permittivity. */
function microstripValidity(staticRange: string) {
  return [
    {
      code: "width_ratio",
      when: (x: MicrostripInputs) => x.width / x.height < 0.01 || x.width / x.height > 100,
      measure: (x: MicrostripInputs) => Math.max(x.height / x.width / 100, x.width / x.height / 100),
      message: (x: MicrostripInputs) =>
        `width/height = ${formatNumber(x.width / x.height)} lies outside 0.01-100, where Hammerstad and Jensen (1980) state ${staticRange}; the expressions are extrapolated here`,
    },
    {
      code: "permittivity_range",
      when: (x: MicrostripInputs) => x.relativePermittivity > 128,
      measure: (x: MicrostripInputs) => x.relativePermittivity / 128,
      message: (x: MicrostripInputs) =>
        `relativePermittivity ${formatNumber(x.relativePermittivity)} is above 128, the limit of Hammerstad and Jensen's (1980) effective-permittivity fit`,
    },
    {
      code: "thick_strip",
      when: (x: MicrostripInputs) => x.thickness > 0.2 * x.height || x.thickness > 0.5 * x.width,
      measure: (x: MicrostripInputs) => Math.max(x.thickness / x.height / 0.2, x.thickness / x.width / 0.5),
      message: (x: MicrostripInputs) =>
        `thickness is ${formatNumber(x.thickness / x.height)} of the height and ${formatNumber(x.thickness / x.width)} of the width; the Hammerstad-Jensen thickness correction is a small-thickness model and loses accuracy for strips thicker than about a fifth of the substrate or half their width (common practice)`,
    },
    {
      code: "dispersion_range",
      when: (x: MicrostripInputs) =>
        x.frequency > 0 &&
        (electricalHeight(x) > 0.13 || x.relativePermittivity > 20 || x.width / x.height < 0.1 || x.width / x.height > 100),
      measure: (x: MicrostripInputs) =>
        Math.max(electricalHeight(x) / 0.13, x.relativePermittivity / 20, 0.1 / (x.width / x.height), x.width / x.height / 100),
      message: (x: MicrostripInputs) =>
        `the frequency model of Kirschning and Jansen (1982) is stated for 0.1 <= width/height <= 100, relativePermittivity <= 20 and height/wavelength <= 0.13 (about 0.6 % there); here width/height = ${formatNumber(x.width / x.height)}, relativePermittivity = ${formatNumber(x.relativePermittivity)}, height/wavelength = ${formatNumber(electricalHeight(x))}`,
    },
    {
      code: "higher_modes",
      // The first transverse resonance / surface-wave cutoff near f h = c / (4 h sqrt(epsr - 1))
      // (common practice): above it the single-mode picture fails.
      when: (x: MicrostripInputs) => x.relativePermittivity > 1 && electricalHeight(x) * 4 * Math.sqrt(x.relativePermittivity - 1) > 1,
      measure: (x: MicrostripInputs) => electricalHeight(x) * 4 * Math.sqrt(x.relativePermittivity - 1),
      message: (x: MicrostripInputs) =>
        `height/wavelength = ${formatNumber(electricalHeight(x))} is above 1/(4 sqrt(epsr - 1)), where the lowest surface-wave mode of the substrate couples strongly to the line (common practice): the line no longer carries one quasi-TEM mode`,
    },
  ];
}

/**
 * Characteristic impedance of a microstrip line: a strip of width w and
 * thickness t on a substrate of height h and relative permittivity epsr over
 * a ground plane.
 *
 * Quasi-static (Hammerstad & Jensen 1980): with u = w/h,
 *   Z01(u) = (eta0 / 2 pi) ln( f(u)/u + sqrt(1 + 4/u^2) ),
 *   f(u) = 6 + (2 pi - 6) exp(-(30.666/u)^0.7528),
 * and Z0 = Z01(ur) / sqrt(eps_eff(ur, epsr)) with the thickness-corrected width
 * ur = u + du_r (see microstripEffectivePermittivity), eta0 = mu0 c in ohm.
 * Above 0 Hz the frequency dependence of Jansen & Kirschning (1983), which
 * builds on the effective permittivity of Kirschning & Jansen (1982).
 *
 * Stated accuracy: Z01 better than 0.01 % for u <= 1 and 0.03 % for u <= 1000;
 * eps_eff better than 0.2 % for epsr <= 128 and 0.01 <= u <= 100; frequency
 * model within about 0.6 % up to h/lambda0 = 0.13 (all from memory). Losses,
 * the ground plane's finite extent and the cover are neglected. Jansen and
 * Kirschning's impedance expression is singular for substrates just above air
 * (below about 1.05): for 1 < epsr < 1.1 its frequency factor is interpolated
 * between air and epsr = 1.1 (warned as near_air_substrate; see NEAR_AIR).
 *
 * @example
 * microstripImpedance({ width: quantity(3, "mm"), height: quantity(1.6, "mm"), relativePermittivity: 4.4 }); // ≈ 50 ohm
 */
export const microstripImpedance = /* @__PURE__ */ defineFormula({
  id: "microstripImpedance",
  title: "Microstrip characteristic impedance",
  category: CATEGORY,
  description:
    "Characteristic impedance of a microstrip (a strip on a substrate over a ground plane) by Hammerstad and Jensen (1980) with their strip-thickness correction; above 0 Hz with the frequency dependence of Jansen and Kirschning (1983).",
  equation: "Z0 = (eta0 / (2 pi sqrt(eps_eff))) ln( f(u)/u + sqrt(1 + 4/u^2) ), u = w/h, f(u) = 6 + (2 pi - 6) exp(-(30.666/u)^0.7528)",
  inputs: INPUTS,
  relations: NOT_TOO_NARROW,
  output: { dimension: "Resistance", description: "Characteristic impedance" },
  validity: [
    ...microstripValidity("Z01 to 0.03 % and eps_eff to 0.2 %"),
    {
      code: "near_air_substrate",
      when: (x: MicrostripInputs) => x.frequency > 0 && x.relativePermittivity > 1 && x.relativePermittivity < NEAR_AIR,
      measure: (x: MicrostripInputs) => NEAR_AIR / x.relativePermittivity,
      message: (x: MicrostripInputs) =>
        `relativePermittivity ${formatNumber(x.relativePermittivity)} is below 1.1, where Jansen and Kirschning's (1983) frequency-dependent impedance is singular (its R13 and R14 pass through zero near eps_eff = 1.02); ` +
        "the frequency factor here is interpolated between air (no dispersion) and its value at 1.1, an estimate of this library and not a published model: the quasi-static impedance is reliable, its frequency change is not",
    },
  ],
  source: [HAMMERSTAD_JENSEN, KIRSCHNING_JANSEN, JANSEN_KIRSCHNING],
  compute: (x) => {
    const u = x.width / x.height;
    const er = x.relativePermittivity;
    const line = staticLine(u, x.thickness / x.height, er);
    if (x.frequency === 0) return line.z0;
    return impedanceAt(u, x.thickness / x.height, er, line, normalisedFrequency(x.frequency, x.height));
  },
});

/**
 * Effective relative permittivity of a microstrip line: the permittivity of a
 * uniform medium in which the line would have the same phase velocity
 * (v = c / sqrt(eps_eff)).
 *
 * Quasi-static (Hammerstad & Jensen 1980), u = w/h:
 *   eps_eff = (epsr + 1)/2 + ((epsr - 1)/2) (1 + 10/u)^(-a(u) b(epsr)),
 *   a(u) = 1 + ln((u^4 + (u/52)^2)/(u^4 + 0.432))/49 + ln(1 + (u/18.1)^3)/18.7,
 *   b(epsr) = 0.564 ((epsr - 0.9)/(epsr + 3))^0.053.
 * Thickness t (T = t/h): du1 = (T/pi) ln(1 + 4e / (T coth^2 sqrt(6.517 u))),
 * du_r = (1 + sech sqrt(epsr - 1)) du1 / 2, u1 = u + du1, ur = u + du_r, and
 * eps_eff = eps_eff(ur) (Z01(u1)/Z01(ur))^2.
 * Above 0 Hz (Kirschning & Jansen 1982), fn = f h in GHz mm:
 *   eps_eff(f) = epsr - (epsr - eps_eff(0)) / (1 + P(f)), P = P1 P2 ((0.1844 + P3 P4) fn)^1.5763.
 *
 * Stated accuracy: 0.2 % for epsr <= 128 and 0.01 <= u <= 100 (static); 0.6 %
 * for 0.1 <= u <= 100, epsr <= 20, h/lambda0 <= 0.13 (dispersion), from memory.
 *
 * @example
 * microstripEffectivePermittivity({ width: quantity(3, "mm"), height: quantity(1.6, "mm"), relativePermittivity: 4.4 }); // ≈ 3.34
 */
export const microstripEffectivePermittivity = /* @__PURE__ */ defineFormula({
  id: "microstripEffectivePermittivity",
  title: "Microstrip effective permittivity",
  category: CATEGORY,
  description:
    "Effective relative permittivity of a microstrip by Hammerstad and Jensen (1980) with their strip-thickness correction; above 0 Hz the dispersion model of Kirschning and Jansen (1982).",
  equation: "eps_eff = (epsr + 1)/2 + ((epsr - 1)/2) (1 + 10/u)^(-a(u) b(epsr)); eps_eff(f) = epsr - (epsr - eps_eff(0)) / (1 + P(f))",
  inputs: INPUTS,
  relations: NOT_TOO_NARROW,
  output: { dimension: "Dimensionless", description: "Effective relative permittivity" },
  validity: microstripValidity("eps_eff to 0.2 %"),
  source: [HAMMERSTAD_JENSEN, KIRSCHNING_JANSEN],
  compute: (x) => {
    const u = x.width / x.height;
    const er = x.relativePermittivity;
    const line = staticLine(u, x.thickness / x.height, er);
    if (x.frequency === 0) return line.ee0;
    return dispersivePermittivity(u, er, line.ee0, normalisedFrequency(x.frequency, x.height));
  },
});
