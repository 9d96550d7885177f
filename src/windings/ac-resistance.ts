import { MU0 } from "../constants/si.js";
import { defineFormula } from "../core/formula.js";
import { POSITIVE, RELATIVE_PERMEABILITY } from "../core/spec.js";
import { GOOD_CONDUCTOR_PER_HZ } from "../flux/losses.js";
import { cappedRatio } from "../math/ratios.js";
import { Scaled, moderate } from "../math/scaled.js";
import { roundWireResistanceRatio } from "./kelvin.js";
import { CONDUCTOR_CONDUCTIVITY, IEC_60028 } from "./shared.js";

const PI_MU0 = Math.PI * MU0;

/**
 * radius / skin depth = (d / 2) sqrt(pi f mu0 mur sigma). Plain while every factor is moderate;
 * otherwise the product under the root is held as mantissa and exponent, so no step
 * overflows or underflows before the ratio does.
 */
export function radiusOverSkinDepth(diameter: number, frequency: number, relativePermeability: number, conductivity: number): number {
  if (moderate(diameter) && moderate(frequency) && moderate(relativePermeability) && moderate(conductivity)) {
    return 0.5 * diameter * Math.sqrt(PI_MU0 * frequency * relativePermeability * conductivity);
  }
  const root = Scaled.of(PI_MU0).times(frequency).times(Scaled.of(relativePermeability).times(conductivity)).sqrt();
  const x = root.times(diameter).times(0.5);
  // Below the smallest subnormal the ratio is 0 for every purpose here (the factor is then exactly 1).
  return x.e < -1074 ? 0 : x.toNumber();
}

/**
 * Skin-effect AC resistance factor R_ac / R_dc of an isolated straight round wire.
 *
 * R_ac / R_dc = Re[(z / 2) J0(z) / J1(z)], z = (1 - j) a / delta, with a = d / 2 the radius
 * and delta = 1 / sqrt(pi f mu0 mur sigma) the skin depth; in Kelvin functions of
 * q = sqrt(2) a / delta, (q / 2) (ber q bei' q - bei q ber' q) / (ber'^2 q + bei'^2 q).
 * Tends to 1 + q^4 / 192 at low frequency and to a / (2 delta) + 1/4 + 3 delta / (32 a) at high.
 *
 * Assumptions: a solid round conductor far from other conductors (no proximity effect:
 * inside a winding use dowellAcResistanceFactor), a good conductor (warned otherwise),
 * linear permeability.
 *
 * Accuracy: within 1e-14 relative of the exact Bessel-function ratio for every
 * a / delta from 0 to 1e308 (about 1e-15 except just below a / delta = 12, where the
 * series gives way to Hankel's expansion), measured against a decimal.js oracle by
 * tests/windings/extremes-accuracy.test.ts.
 *
 * Reference: S. Ramo, J. R. Whinnery, T. Van Duzer, Fields and Waves in Communication
 * Electronics, 3rd ed. (1994), sec. 5.6, internal impedance of a round wire (section from
 * memory); series and asymptotic forms DLMF 10.2.2 and 10.17.3.
 *
 * @example
 * roundWireAcResistanceFactor({ diameter: quantity(1, "mm"), frequency: quantity(100, "kHz") }); // ≈ 1.45
 */
export const roundWireAcResistanceFactor = /* @__PURE__ */ defineFormula({
  id: "roundWireAcResistanceFactor",
  title: "Round wire AC resistance factor (skin effect)",
  category: "winding",
  description:
    "Ratio of AC to DC resistance of an isolated straight solid round wire from skin effect, exact from Bessel (Kelvin) functions of radius over skin depth. " +
    "Proximity effect of neighbouring turns is not included (see dowellAcResistanceFactor for windings).",
  equation: "R_ac/R_dc = Re[(z/2) J0(z)/J1(z)], z = (1 - j) (d/2) sqrt(pi f mu0 mur sigma)",
  inputs: [
    { name: "diameter", dimension: "Length", description: "Diameter of the bare conductor", domain: POSITIVE, example: 1e-3 },
    { name: "frequency", dimension: "Frequency", description: "Frequency of the sinusoidal current", domain: POSITIVE, example: 100e3 },
    { name: "conductivity", ...CONDUCTOR_CONDUCTIVITY },
    { name: "relativePermeability", ...RELATIVE_PERMEABILITY, description: "Relative permeability of the conductor (1 for copper and aluminium)", example: 1 },
  ],
  output: { dimension: "Dimensionless", description: "R_ac / R_dc" },
  validity: [
    {
      code: "not_a_good_conductor",
      // Conduction current must dominate displacement current: sigma / (omega eps0) >> 1.
      when: (x) => x.conductivity < GOOD_CONDUCTOR_PER_HZ * x.frequency,
      measure: (x) => cappedRatio(GOOD_CONDUCTOR_PER_HZ * x.frequency, x.conductivity),
      message: "conductivity is below 100 times omega * eps0: displacement current is not negligible and the skin-effect solution no longer applies",
    },
  ],
  source: [
    { authors: "S. Ramo, J. R. Whinnery, T. Van Duzer", year: 1994, title: "Fields and Waves in Communication Electronics, 3rd ed.", locator: "sec. 5.6, internal impedance of a round wire (from memory)" },
    { authors: "NIST", year: 2010, title: "Digital Library of Mathematical Functions", locator: "eqs. 10.2.2 (ascending series), 10.17.3 (Hankel's expansion)" },
    IEC_60028,
  ],
  // x = a / delta, then the ratio by series or Hankel's expansion (src/windings/kelvin.ts);
  // an x beyond the doubles is Infinity, reported as out_of_range.
  compute: (x) => roundWireResistanceRatio(radiusOverSkinDepth(x.diameter, x.frequency, x.relativePermeability, x.conductivity)),
});
