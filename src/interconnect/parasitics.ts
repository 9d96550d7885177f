import { MU0 } from "../constants/si.js";
import { formatNumber } from "../core/format.js";
import { defineFormula } from "../core/formula.js";
import { POSITIVE } from "../core/spec.js";
import { logOfRatio } from "../math/ratios.js";
import { exponentOf, ldexp, moderate, scaledProduct } from "../math/scaled.js";
import { CATEGORY } from "./shared.js";

const MU0_OVER_2PI = MU0 / (2 * Math.PI);

/**
 * Goldfarb & Pucel's via bracket ln((h + sqrt(r^2 + h^2))/r) + 1.5 (r - sqrt(r^2 + h^2))/h,
 * written as asinh(h/r) - 1.5 h/(r + sqrt(r^2 + h^2)) (no cancellation of the square root
 * against r); asinh as ln 2 + ln(h/r) past 1e8, the middle ratio with both lengths
 * scaled by one power of two so nothing overflows. At least 0.25 h/r for short vias.
 */
function viaBracket(h: number, r: number): number {
  const t = h / r;
  const asinh = t > 1e8 ? Math.LN2 + logOfRatio(h, r) : Math.asinh(t);
  let middle: number;
  if (moderate(h) && moderate(r)) middle = h / (Math.hypot(h, r) + r);
  else {
    const s = -exponentOf(Math.max(h, r));
    const hs = ldexp(h, s);
    const rs = ldexp(r, s);
    middle = hs / (Math.hypot(hs, rs) + rs);
  }
  return asinh - 1.5 * middle;
}

/**
 * Inductance of a through via (a cylindrical post of height h and radius r to a
 * ground plane), Goldfarb & Pucel (1991):
 *   L = (mu0 / 2 pi) [ h ln((h + sqrt(r^2 + h^2))/r) + 1.5 (r - sqrt(r^2 + h^2)) ],
 * h and r in m, L in H. A quasi-static fit to measured vias in GaAs and alumina
 * substrates, within a few per cent of their measurements (from memory); the
 * return path and the pads are not included.
 *
 * @example
 * viaInductance({ height: quantity(1.6, "mm"), radius: quantity(0.15, "mm") }); // ≈ 0.54 nH
 */
export const viaInductance = /* @__PURE__ */ defineFormula({
  id: "viaInductance",
  title: "Via inductance",
  category: CATEGORY,
  description: "Inductance of a cylindrical via hole through a substrate to a ground plane (Goldfarb and Pucel 1991); pads and the return path excluded.",
  equation: "L = (mu0 / 2 pi) [ h ln((h + sqrt(r^2 + h^2)) / r) + 1.5 (r - sqrt(r^2 + h^2)) ]",
  inputs: [
    { name: "height", dimension: "Length", description: "Height of the via (substrate thickness)", domain: POSITIVE, example: 1.6e-3 },
    { name: "radius", dimension: "Length", description: "Radius of the via barrel", domain: POSITIVE, example: 1.5e-4 },
  ],
  output: { dimension: "Inductance", description: "Via inductance" },
  validity: [
    {
      code: "short_via",
      when: (x) => x.height < x.radius,
      measure: (x) => x.radius / x.height,
      message: (x) =>
        `the via is ${formatNumber(x.radius / x.height)} times wider (in radius) than it is high; Goldfarb and Pucel's fit was checked against vias taller than their radius (from memory), and pads dominate so short a via`,
    },
  ],
  source: {
    authors: "M. E. Goldfarb, R. A. Pucel", year: 1991,
    title: "Modeling via hole grounds in microstrip, IEEE Microwave and Guided Wave Letters 1(6), pp. 135-137", locator: "eq. (1) (from memory)",
  },
  compute: (x) => {
    const b = viaBracket(x.height, x.radius);
    return moderate(x.height) ? MU0_OVER_2PI * x.height * b : scaledProduct([MU0_OVER_2PI, x.height, b]);
  },
});

/**
 * Partial self-inductance of a straight rectangular trace (a bar of length l,
 * width w, thickness t), in the form Ruehli (1972) gives for l >> w + t (after
 * Grover):
 *   L = (mu0 l / 2 pi) [ ln(2 l / (w + t)) + 1/2 + 0.2235 (w + t) / l ],
 * lengths in m, L in H. Uniform (low-frequency) current; no ground plane (a
 * trace over a plane has far less loop inductance: use the line's Z0 and delay).
 * Warned when l < 10 (w + t), where the form drifts from the exact bar formula.
 *
 * @example
 * traceInductance({ length: quantity(20, "mm"), width: quantity(0.25, "mm"), thickness: quantity(35, "um") }); // ≈ 22 nH
 */
export const traceInductance = /* @__PURE__ */ defineFormula({
  id: "traceInductance",
  title: "Trace inductance (rectangular bar)",
  category: CATEGORY,
  description: "Partial self-inductance of a straight rectangular conductor with uniform current, no ground plane; the long-bar form given by Ruehli (1972).",
  equation: "L = (mu0 l / 2 pi) [ ln(2 l / (w + t)) + 1/2 + 0.2235 (w + t) / l ]",
  inputs: [
    { name: "length", dimension: "Length", description: "Length of the trace", domain: POSITIVE, example: 0.02 },
    { name: "width", dimension: "Length", description: "Width of the trace", domain: POSITIVE, example: 2.5e-4 },
    { name: "thickness", dimension: "Length", description: "Thickness of the copper", domain: POSITIVE, example: 3.5e-5 },
  ],
  output: { dimension: "Inductance", description: "Partial self-inductance" },
  validity: [
    {
      code: "short_trace",
      when: (x) => x.length < 10 * (x.width / 2 + x.thickness / 2) * 2,
      measure: (x) => (x.width + x.thickness) / x.length,
      message: (x) =>
        `the trace is only ${formatNumber(x.length / (x.width + x.thickness))} times as long as its width plus thickness; the long-bar form assumes l >> w + t (Ruehli 1972) and drifts from the exact bar formula below about 10 (common practice)`,
    },
  ],
  source: {
    authors: "A. E. Ruehli", year: 1972,
    title: "Inductance calculations in a complex integrated circuit environment, IBM Journal of Research and Development 16(5), pp. 470-481",
    locator: "approximate partial self-inductance of a rectangular bar for l >> w + t (from memory)",
  },
  compute: (x) => {
    // (w + t)/2 by halving first, so the sum cannot overflow; ln(2l/(w + t)) = ln(l / ((w + t)/2)).
    const half = x.width / 2 + x.thickness / 2;
    const bracket = logOfRatio(x.length, half) + 0.5 + 0.447 * (half / x.length);
    return moderate(x.length) ? MU0_OVER_2PI * x.length * bracket : scaledProduct([MU0_OVER_2PI, x.length, bracket]);
  },
});

/** IEC 60028 international annealed copper: resistivity at 20 degC, ohm m (1/58 ohm mm^2/m). */
export const ANNEALED_COPPER_RESISTIVITY = 1 / 58e6;
/** IEC 60028: constant-mass temperature coefficient of resistance at 20 degC, 1/K. */
export const ANNEALED_COPPER_COEFFICIENT = 0.00393;
const T20 = 293.15;

/**
 * DC resistance of a copper trace of length l, width w, thickness t at temperature T:
 *   R = rho20 (1 + alpha20 (T - 20 degC)) l / (w t),
 * rho20 = 1/58 ohm mm^2/m = 1.7241e-8 ohm m and alpha20 = 0.00393 /K for annealed
 * copper (IEC 60028). T in K (unit strings such as "85 degC" are converted). Uniform
 * current (DC; the skin effect is not included). The linear coefficient is warned
 * outside -50 degC to 200 degC.
 *
 * @example
 * traceResistance({ length: quantity(100, "mm"), width: quantity(0.25, "mm"), thickness: quantity(35, "um") }); // ≈ 0.197 ohm
 */
export const traceResistance = /* @__PURE__ */ defineFormula({
  id: "traceResistance",
  title: "Copper trace resistance",
  category: CATEGORY,
  description: "DC resistance of a rectangular annealed-copper trace at a given temperature (IEC 60028 resistivity and temperature coefficient).",
  equation: "R = rho20 (1 + alpha20 (T - 293.15 K)) l / (w t), rho20 = 1.7241e-8 ohm m, alpha20 = 0.00393 /K",
  inputs: [
    { name: "length", dimension: "Length", description: "Length of the trace", domain: POSITIVE, example: 0.1 },
    { name: "width", dimension: "Length", description: "Width of the trace", domain: POSITIVE, example: 2.5e-4 },
    { name: "thickness", dimension: "Length", description: "Thickness of the copper", domain: POSITIVE, example: 3.5e-5 },
    { name: "temperature", dimension: "Temperature", description: "Temperature of the copper (default 20 degC)", default: T20, domain: POSITIVE, example: T20 },
  ],
  output: { dimension: "Resistance", description: "DC resistance" },
  relations: [
    {
      // 1 + alpha (T - 293.15) reaches 0 near 38.7 K: the linear law means nothing there.
      rule: "temperature > 40 K (the linear temperature law of IEC 60028 gives zero resistance near 39 K)",
      holds: (x) => x.temperature > 40,
    },
  ],
  validity: [
    {
      code: "temperature_range",
      when: (x) => x.temperature < 223.15 || x.temperature > 473.15,
      measure: (x) => Math.max(223.15 / x.temperature, x.temperature / 473.15),
      message: (x) =>
        `the temperature ${formatNumber(x.temperature - 273.15)} degC is outside -50 degC to 200 degC, where copper's linear temperature coefficient holds to about 1 % (common practice)`,
    },
  ],
  source: { authors: "IEC", year: 2004, title: "IEC 60028: International standard of resistance for copper", locator: "resistivity 1/58 ohm mm^2/m and temperature coefficient 0.00393 /K at 20 degC (from memory)" },
  compute: (x) => {
    const factor = 1 + ANNEALED_COPPER_COEFFICIENT * (x.temperature - T20);
    return scaledProduct([ANNEALED_COPPER_RESISTIVITY, factor, x.length], [x.width, x.thickness]);
  },
});
