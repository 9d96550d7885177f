import { defineFormula } from "../core/formula.js";
import { formatNumber } from "../core/format.js";
import { POSITIVE } from "../core/spec.js";
import { scaledProduct } from "../math/scaled.js";
import {
  ALUMINIUM_ALPHA_20C, ALUMINIUM_RESISTIVITY_20C, COPPER_ALPHA_20C, COPPER_RESISTIVITY_20C, IEC_60028, IEC_60889,
  REFERENCE_TEMPERATURE,
} from "./shared.js";

/**
 * American Wire Gauge sizes, as written on reels and in ASTM B258's table: "4/0" (also
 * written 0000), "3/0", "2/0", "1/0" (0), then "1" to "40". Strings, so that "4/0" is not
 * mistaken for a number and no size outside the standard's table can be asked for.
 */
export const WIRE_GAUGES = [
  "4/0", "3/0", "2/0", "1/0", "1", "2", "3", "4", "5", "6", "7", "8", "9", "10", "11",
  "12", "13", "14", "15", "16", "17", "18", "19", "20", "21", "22", "23", "24", "25", "26",
  "27", "28", "29", "30", "31", "32", "33", "34", "35", "36", "37", "38", "39", "40",
] as const;
export type WireGauge = (typeof WIRE_GAUGES)[number];

/** The gauge number n of the ASTM B258 rule: 4/0 -> -3, 3/0 -> -2, 2/0 -> -1, 1/0 -> 0, "k" -> k. */
function gaugeNumber(g: string): number {
  return g.endsWith("/0") ? 1 - Number(g[0]) : Number(g);
}

/**
 * Diameter of a solid round wire of an American Wire Gauge size.
 *
 * d = 0.127 mm * 92^((36 - n) / 39), with n the gauge number (4/0 is n = -3, 1/0 is n = 0):
 * 39 steps between 0.46 in (4/0) and 0.005 in (36), each size 92^(1/39) = 1.1229 times
 * the next. Exact by the standard's definition; its table rounds to 0.0001 in.
 *
 * Reference: ASTM B258, Standard Specification for Standard Nominal Diameters and
 * Cross-Sectional Areas of AWG Sizes of Solid Round Wires Used as Electrical Conductors,
 * sec. 4 and Table 1 (section numbers from memory).
 *
 * @example
 * wireGaugeDiameter({ gauge: "24" }); // ≈ 0.511 mm
 */
export const wireGaugeDiameter = /* @__PURE__ */ defineFormula({
  id: "wireGaugeDiameter",
  title: "Wire gauge diameter (AWG)",
  category: "winding",
  description: "Nominal diameter of a solid round wire of an American Wire Gauge size, 4/0 to 40, by the ASTM B258 rule (bare conductor; insulation adds to it).",
  equation: "d = 0.127 mm * 92^((36 - n) / 39), n = gauge number (4/0 -> -3, 1/0 -> 0)",
  inputs: [
    { name: "gauge", choices: WIRE_GAUGES, description: "AWG size: 4/0, 3/0, 2/0, 1/0, then 1 to 40", example: "24" },
  ],
  output: { dimension: "Length", description: "Bare conductor diameter" },
  source: {
    authors: "ASTM International",
    year: 2018,
    title: "ASTM B258: Standard Nominal Diameters and Cross-Sectional Areas of AWG Sizes of Solid Round Wires Used as Electrical Conductors",
    locator: "d = 0.005 in x 92^((36 - n)/39), Table 1 (edition year from memory)",
  },
  // One pow of a moderate base to an exponent in [-4/39, 1]: within an ulp or two, plus the
  // exponent's own rounding (times ln 92 < 5): a few ulp in all.
  compute: (x) => 0.127e-3 * Math.pow(92, (36 - gaugeNumber(x.gauge)) / 39),
});

/** Inclusive range (K) over which the linear 20 degC temperature law is used (-50 to +200 degC; common practice, from memory). */
const LINEAR_LOW = 223.15;
const LINEAR_HIGH = 473.15;

/**
 * Per material: resistivity at 20 degC, its temperature coefficient, and the temperature
 * T0 = 20 degC - 1/alpha20 at which the linear law reaches zero, as an unevaluated sum
 * hi + lo of two doubles (from 50-digit decimal arithmetic on the standards' decimal values:
 * copper 38.697073791348600508905852... K, aluminium 45.011042183622828784119106... K), so
 * T - T0 keeps its digits near T0 (where T - hi is exact by Sterbenz's lemma).
 */
const MATERIALS = {
  copper: { rho: COPPER_RESISTIVITY_20C, alpha: COPPER_ALPHA_20C, t0: 38.6970737913486, t0lo: 5.089058524173028e-16 },
  aluminium: { rho: ALUMINIUM_RESISTIVITY_20C, alpha: ALUMINIUM_ALPHA_20C, t0: 45.01104218362283, t0lo: -1.215880893300248e-15 },
} as const;

/**
 * DC resistance of a round solid wire at a temperature.
 *
 * R = rho20 (1 + alpha20 (T - 20 degC)) l / (pi d^2 / 4), R in ohm, l and d in m, T in K;
 * rho20 and alpha20 of annealed copper (IEC 60028: 1/58 ohm mm^2/m, 0.00393/K) or
 * hard-drawn aluminium (IEC 60889 / 60111: 0.028264 ohm mm^2/m, 0.00403/K).
 * Temperatures as unit strings take an offset unit: "75 degC" is 348.15 K.
 *
 * Validity: the linear law with the 20 degC coefficient is the standards' correction;
 * a warning outside -50 to +200 degC (common practice, from memory) where real
 * resistivity departs from the line. Refused at or below the line's zero (-234.5 degC
 * copper, -228.1 degC aluminium). DC only: see roundWireAcResistanceFactor for AC.
 *
 * @example
 * wireResistance({ length: quantity(10, "m"), diameter: quantity(0.511, "mm") }); // ≈ 0.841 ohm
 */
export const wireResistance = /* @__PURE__ */ defineFormula({
  id: "wireResistance",
  title: "Wire resistance (DC)",
  category: "winding",
  description: "DC resistance of a solid round copper or aluminium wire at a temperature, by the standard resistivities at 20 degC and their linear temperature coefficients.",
  equation: "R = rho20 (1 + alpha20 (T - 293.15 K)) * l / (pi d^2 / 4)",
  inputs: [
    { name: "length", dimension: "Length", description: "Length of the wire", domain: POSITIVE, example: 10 },
    { name: "diameter", dimension: "Length", description: "Diameter of the bare conductor", domain: POSITIVE, example: 0.511e-3 },
    { name: "temperature", dimension: "Temperature", description: "Conductor temperature (default 20 degC = 293.15 K)", default: REFERENCE_TEMPERATURE, domain: POSITIVE, example: 348.15 },
    { name: "material", choices: ["copper", "aluminium"], description: "Conductor material: annealed copper (IEC 60028) or hard-drawn aluminium (IEC 60889)", default: "copper", example: "copper" },
  ],
  output: { dimension: "Resistance", description: "DC resistance" },
  relations: [
    {
      rule: "temperature above the linear law's zero (-234.5 degC = 38.65 K copper, -228.1 degC = 45.0 K aluminium)",
      holds: (x) => x.temperature > MATERIALS[x.material].t0,
    },
  ],
  validity: [
    {
      code: "outside_temperature_law",
      when: (x) => x.temperature < LINEAR_LOW || x.temperature > LINEAR_HIGH,
      // Distance outside -50..+200 degC as a ratio of temperature spans (> 1 when warned).
      measure: (x) => 1 + Math.max(LINEAR_LOW - x.temperature, x.temperature - LINEAR_HIGH) / (LINEAR_HIGH - LINEAR_LOW),
      message: (x) =>
        `${formatNumber(x.temperature - 273.15, 4)} degC is outside -50 to +200 degC, where the linear temperature law with the 20 degC coefficient is used (common practice): ` +
        "the real resistivity departs from the line (it levels off towards cryogenic temperatures and rises faster when hot); use measured resistivity",
    },
  ],
  source: [IEC_60028, IEC_60889],
  // rho20 (1 + alpha (T - T20)) = rho20 alpha (T - T0) with T0 = T20 - 1/alpha the line's zero:
  // T - T0 from the two-part T0 (no loss near T0, which the relation keeps T above), then a
  // product of factors and divisors with no intermediate overflow or underflow (scaledProduct).
  // Constant (4/pi) rho alpha: three roundings.
  compute: (x) => {
    const m = MATERIALS[x.material];
    return scaledProduct([(4 / Math.PI) * m.rho * m.alpha, x.temperature - m.t0 - m.t0lo, x.length], [x.diameter, x.diameter]);
  },
});
