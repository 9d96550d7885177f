import { defineFormula } from "../core/formula.js";
import { COUNT, POSITIVE } from "../core/spec.js";
import { countLoop } from "../math/loop-count.js";
import { cappedRatio } from "../math/ratios.js";
import { Scaled } from "../math/scaled.js";
import { radiusOverSkinDepth } from "./ac-resistance.js";
import { CONDUCTOR_CONDUCTIVITY } from "./shared.js";

const DOWELL = {
  authors: "P. L. Dowell",
  year: 1966,
  title: "Effects of eddy currents in transformer windings, Proc. IEE 113(8), 1387-1394",
  locator: "eq. (11) for the layer resistance factor (equation number from memory)",
} as const;

/** Below this Delta the two ratios are summed as power series (all terms positive). */
const SERIES_BELOW = 2;
/** Most series terms: Delta^(4k) / (4k)! at Delta = 2 and k = 10 is 2^40 / 40! < 1e-35. */
const MAX_TERMS = 10;

/**
 * D (sinh 2D + sin 2D) / (cosh 2D - cos 2D) (the skin term) and the proximity term
 * s2 = (sinh D - sin D) / (cosh D + cos D), for D = Delta > 0: below D = 2 as s2 / D^3
 * (`proximityOverCube`, so D^4 s2 / D^3 never underflows through D^3), from D = 2 on as s2.
 *
 * Below D = 2 both come from power series with positive terms only (u = 2D):
 *   D (sinh u + sin u)/(cosh u - cos u) = [sum u^(4k+1)/(4k+1)!] / [sum 2 u^(4k+1)/(4k+2)!] -> 1 + 4 D^4 / 45,
 *   (sinh D - sin D)/(cosh D + cos D) / D^3 = [sum D^(4k)/(4k+3)!] / [sum D^(4k)/(4k)!] -> 1/6,
 * so the cancellation of cosh - cos and sinh - sin near 0 never happens. From D = 2 on, numerator and
 * denominator are divided by e^u (e^D): no overflow for any D, and no cancellation (the
 * numerators stay above 0.7 there).
 */
export function dowellTerms(delta: number): { skin: number; proximityOverCube: number; proximity: number } {
  if (delta < SERIES_BELOW) {
    const d4 = delta * delta * delta * delta;
    const u4 = 16 * d4;
    // Skin: numerator sum u^(4k)/(4k+1)!, denominator sum 2 u^(4k)/(4k+2)! (one factor u cancelled).
    // Proximity: numerator sum D^(4k)/(4k+3)!, denominator sum D^(4k)/(4k)!.
    let sn = 1, sd = 1, pn = 1 / 6, pd = 1;
    let tu = 1, td = 1; // u^(4k), D^(4k)
    let f = 1; // (4k)!
    let k = 1;
    for (; k <= MAX_TERMS; k++) {
      tu *= u4;
      td *= d4;
      const n = 4 * k;
      f *= (n - 3) * (n - 2) * (n - 1) * n;
      const tsn = tu / (f * (n + 1));
      sn += tsn;
      sd += (2 * tu) / (f * (n + 1) * (n + 2));
      pn += td / (f * (n + 1) * (n + 2) * (n + 3));
      pd += td / f;
      if (tsn < 1e-18 * sn) break; // the other three terms are smaller still relative to their sums
    }
    countLoop(Math.min(k, MAX_TERMS));
    return { skin: sn / sd, proximityOverCube: pn / pd, proximity: NaN };
  }
  const u = 2 * delta;
  const eu = Math.exp(-u); // e^{-2D}
  const ed = Math.exp(-delta);
  // For large D, e^{-D} underflows to 0 and the sines and cosines (finite for any finite D) drop out.
  const skin = (delta * (-Math.expm1(-2 * u) + 2 * Math.sin(u) * eu)) / (1 + eu * eu - 2 * Math.cos(u) * eu);
  const prox = (-Math.expm1(-u) - 2 * Math.sin(delta) * ed) / (1 + eu + 2 * Math.cos(delta) * ed);
  return { skin, proximityOverCube: NaN, proximity: prox };
}

/**
 * F = Delta [s1 + (2/3)(m^2 - 1) s2]: the skin term plus (2/3)(m - 1)(m + 1) Delta s2, both
 * positive (no cancellation); the second as a scaled product (one rounding per factor), so
 * m^2 or Delta^4 may be out of range while the factor is not.
 */
export function dowellFactor(layers: number, delta: number): number {
  const t = dowellTerms(delta);
  if (layers === 1) return t.skin;
  const p = delta < SERIES_BELOW
    ? Scaled.of(2 / 3).times(layers - 1).times(layers + 1).times(t.proximityOverCube).times(delta).times(delta).times(delta).times(delta)
    : Scaled.of(2 / 3).times(layers - 1).times(layers + 1).times(t.proximity).times(delta);
  // A proximity term below the smallest subnormal cannot change skin >= 1: it counts as 0.
  const proximity = p.e < -1074 ? 0 : p.toNumber();
  return t.skin + proximity;
}

/**
 * AC resistance factor of a foil (or flat-layer) winding portion by Dowell's method.
 *
 * F_R = R_ac / R_dc = Delta [ (sinh 2 Delta + sin 2 Delta) / (cosh 2 Delta - cos 2 Delta)
 *       + (2/3)(m^2 - 1) (sinh Delta - sin Delta) / (cosh Delta + cos Delta) ],
 * with m the number of layers in the portion (from zero MMF to its peak) and Delta = h / delta
 * the layer thickness over the skin depth (the penetration ratio). Tends to
 * 1 + (5 m^2 - 1) Delta^4 / 45 at low frequency and to Delta (1 + (2/3)(m^2 - 1)) at high.
 *
 * Assumptions: one-dimensional field parallel to the layers (layers filling the winding
 * window's height), sinusoidal current, equal currents in every turn of a layer.
 *
 * Reference: P. L. Dowell, Proc. IEE 113 (1966), 1387-1394.
 *
 * @example
 * dowellAcResistanceFactor({ layers: 4, penetrationRatio: 1 }); // ≈ 7.9
 */
export const dowellAcResistanceFactor = /* @__PURE__ */ defineFormula({
  id: "dowellAcResistanceFactor",
  title: "Dowell AC resistance factor (foil layers)",
  category: "winding",
  description:
    "Ratio of AC to DC resistance of a layered foil winding portion from skin and proximity effect by Dowell's one-dimensional method, " +
    "for m layers between zero and peak MMF and a layer thickness of Delta skin depths.",
  equation: "F_R = Delta [(sinh 2D + sin 2D)/(cosh 2D - cos 2D) + (2/3)(m^2 - 1)(sinh D - sin D)/(cosh D + cos D)], D = Delta",
  inputs: [
    { name: "layers", dimension: "Dimensionless", description: "Number of layers m in the winding portion (zero to peak MMF)", domain: COUNT, example: 4 },
    { name: "penetrationRatio", dimension: "Dimensionless", description: "Layer thickness over skin depth, Delta = h / delta", domain: POSITIVE, example: 1 },
  ],
  output: { dimension: "Dimensionless", description: "R_ac / R_dc" },
  source: DOWELL,
  compute: (x) => dowellFactor(x.layers, x.penetrationRatio),
});

/** (pi/4)^(3/4): the round-to-square-to-foil equivalence of Dowell's method. */
const ROUND_TO_FOIL = Math.pow(Math.PI / 4, 0.75);
/** Porosity below which Dowell's 1-D result for round wire is known to err most (see the warning). */
const LOW_POROSITY = 0.6;

/**
 * AC resistance factor of a layered round-wire winding portion by Dowell's method with the porosity factor.
 *
 * Each round wire of diameter d becomes a square of equal area (side (sqrt pi / 2) d), each layer a foil
 * of that thickness with its conductivity reduced by the porosity eta = d / p (p the centre-to-centre
 * pitch of the turns in a layer); then Delta = (pi/4)^(3/4) (d / delta) sqrt(d / p), with delta the
 * skin depth at the frequency, and F_R as dowellAcResistanceFactor.
 *
 * Validity: Dowell's one-dimensional field is poorest for round wire with loosely spaced turns and at
 * frequencies where d exceeds the skin depth: errors of tens of percent are reported (X. Nan and
 * C. R. Sullivan, IEEE PESC 2003; from memory). A warning below d / p = 0.6 with d / delta above 1.
 *
 * Reference: P. L. Dowell, Proc. IEE 113 (1966); porosity factor as in M. P. Perry, Low Frequency
 * Electromagnetic Design (1985) and later texts (from memory).
 *
 * @example
 * dowellRoundWireAcResistanceFactor({ layers: 3, wireDiameter: quantity(0.5, "mm"), pitch: quantity(0.55, "mm"), frequency: quantity(100, "kHz") }); // ≈ 2.3
 */
export const dowellRoundWireAcResistanceFactor = /* @__PURE__ */ defineFormula({
  id: "dowellRoundWireAcResistanceFactor",
  title: "Dowell AC resistance factor (round-wire layers)",
  category: "winding",
  description:
    "Ratio of AC to DC resistance of a layered round-wire winding portion by Dowell's method, with the wire replaced by an equivalent foil " +
    "through the porosity factor d / pitch. One-dimensional field; sinusoidal current.",
  equation: "F_R = Dowell(m, Delta), Delta = (pi/4)^(3/4) (d / delta) sqrt(d / p), delta = 1 / sqrt(pi f mu0 sigma)",
  inputs: [
    { name: "layers", dimension: "Dimensionless", description: "Number of layers m in the winding portion (zero to peak MMF)", domain: COUNT, example: 3 },
    { name: "wireDiameter", dimension: "Length", description: "Diameter of the bare conductor", domain: POSITIVE, example: 0.5e-3 },
    { name: "pitch", dimension: "Length", description: "Centre-to-centre distance of adjacent turns in a layer", domain: POSITIVE, example: 0.55e-3 },
    { name: "frequency", dimension: "Frequency", description: "Frequency of the sinusoidal current", domain: POSITIVE, example: 100e3 },
    { name: "conductivity", ...CONDUCTOR_CONDUCTIVITY },
  ],
  output: { dimension: "Dimensionless", description: "R_ac / R_dc" },
  relations: [{ rule: "wireDiameter <= pitch", holds: (x) => x.wireDiameter <= x.pitch }],
  validity: [
    {
      code: "low_porosity",
      when: (x) => x.wireDiameter < LOW_POROSITY * x.pitch && radiusOverSkinDepth(x.wireDiameter, x.frequency, 1, x.conductivity) > 0.5,
      // How far below the porosity threshold the layer is (> 1 when warned).
      measure: (x) => cappedRatio(LOW_POROSITY * x.pitch, x.wireDiameter),
      message:
        "turns spaced loosely (d / pitch below 0.6) with the wire thicker than a skin depth: Dowell's one-dimensional model errs for round wire here, " +
        "by tens of percent (X. Nan and C. R. Sullivan, IEEE PESC 2003; from memory); use a two-dimensional method",
    },
  ],
  source: [
    DOWELL,
    { authors: "X. Nan, C. R. Sullivan", year: 2003, title: "An improved calculation of proximity-effect loss in high-frequency windings of round conductors, IEEE PESC", locator: "limits of Dowell's method for round wire (from memory)" },
  ],
  // d / delta = 2 (a / delta) from the shared scaled root; sqrt(d / p) <= 1 (the relation), a
  // ratio of two lengths computed as a quotient first (no overflow).
  compute: (x) => {
    const dOverDelta = 2 * radiusOverSkinDepth(x.wireDiameter, x.frequency, 1, x.conductivity);
    return dowellFactor(x.layers, ROUND_TO_FOIL * dOverDelta * Math.sqrt(x.wireDiameter / x.pitch));
  },
});
