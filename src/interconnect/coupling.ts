import { defineFormula } from "../core/formula.js";
import { POSITIVE } from "../core/spec.js";
import { CATEGORY, differenceAndSum } from "./shared.js";

const MODE_INPUTS = [
  { name: "evenImpedance", dimension: "Resistance", description: "Even-mode characteristic impedance of the pair", domain: POSITIVE, example: 60 },
  { name: "oddImpedance", dimension: "Resistance", description: "Odd-mode characteristic impedance of the pair", domain: POSITIVE, example: 40 },
] as const;

const RELATION = [{ rule: "oddImpedance <= evenImpedance", holds: (x: { evenImpedance: number; oddImpedance: number }) => x.oddImpedance <= x.evenImpedance }];

/**
 * Coupling coefficient of a pair of coupled lines from their mode impedances:
 * k = (Ze - Zo)/(Ze + Zo), the voltage coupling of a quarter-wave coupled-line
 * coupler at its centre frequency when matched to sqrt(Ze Zo). (Not the
 * inductors' M / sqrt(L1 L2): that is couplingCoefficient.) Within 1.5 ulp:
 * the difference is exact for close impedances (Sterbenz).
 *
 * @example
 * lineCouplingCoefficient({ evenImpedance: quantity(60, "ohm"), oddImpedance: quantity(40, "ohm") }); // 0.2
 */
export const lineCouplingCoefficient = /* @__PURE__ */ defineFormula({
  id: "lineCouplingCoefficient",
  title: "Coupling coefficient of coupled lines",
  category: CATEGORY,
  description: "Voltage coupling coefficient of two coupled lines from their even- and odd-mode impedances (quarter-wave coupler at centre frequency).",
  equation: "k = (Ze - Zo) / (Ze + Zo)",
  inputs: MODE_INPUTS,
  output: { dimension: "Dimensionless", description: "Coupling coefficient (0 to 1)" },
  relations: RELATION,
  source: { authors: "D. M. Pozar", year: 2012, title: "Microwave Engineering, 4th ed.", locator: "sec. 7.6, coupled-line coupler design, C = (Z0e - Z0o)/(Z0e + Z0o) (from memory)" },
  compute: (x) => {
    const [d, s] = differenceAndSum(x.evenImpedance, x.oddImpedance);
    return d / s;
  },
});

/**
 * Near-end (backward) crosstalk coefficient of a matched coupled pair: the
 * saturated near-end voltage over the driving step on a line longer than half
 * the edge's rise length, K_b = (Lm/L + Cm/C)/4. For a homogeneous dielectric
 * Lm/L = Cm/C = k = (Ze - Zo)/(Ze + Zo), so K_b = k/2; in an inhomogeneous
 * one (microstrip) this is the mean of the two ratios to first order in the
 * coupling. Both lines terminated in their characteristic impedance.
 *
 * @example
 * nearEndCrosstalk({ evenImpedance: quantity(55, "ohm"), oddImpedance: quantity(45, "ohm") }); // 0.05
 */
export const nearEndCrosstalk = /* @__PURE__ */ defineFormula({
  id: "nearEndCrosstalk",
  title: "Near-end crosstalk of a matched coupled pair",
  category: CATEGORY,
  description:
    "Saturated near-end (backward) crosstalk voltage ratio of a matched pair of coupled lines from their mode impedances; weak-coupling form, exact ratio k/2 in a homogeneous dielectric.",
  equation: "K_b = (Lm/L + Cm/C) / 4 = (Ze - Zo) / (2 (Ze + Zo))",
  inputs: MODE_INPUTS,
  output: { dimension: "Dimensionless", description: "Near-end crosstalk voltage ratio" },
  relations: RELATION,
  validity: [
    {
      code: "strong_coupling",
      when: (x) => x.evenImpedance > 1.5 * x.oddImpedance,
      measure: (x) => x.evenImpedance / x.oddImpedance,
      message: "the even-mode impedance is more than 1.5 times the odd-mode one (k > 0.2); the weak-coupling expression neglects the reflections the coupling itself causes on lines matched to a single impedance (common practice)",
    },
  ],
  source: { authors: "S. H. Hall, G. W. Hall, J. A. McCall", year: 2000, title: "High-Speed Digital System Design (Wiley)", locator: "ch. 3, backward crosstalk coefficient (1/4)(Lm/L + Cm/C) (from memory)" },
  compute: (x) => {
    const [d, s] = differenceAndSum(x.evenImpedance, x.oddImpedance);
    return d / (2 * s);
  },
});
