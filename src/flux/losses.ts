import { EPSILON0, MU0 } from "../constants/si.js";
import { defineFormula } from "../core/formula.js";
import { formatNumber } from "../core/format.js";
import { GOVERN } from "../core/hazards.js";
import { NON_NEGATIVE, POSITIVE, RELATIVE_PERMEABILITY } from "../core/spec.js";
import { cappedRatio } from "../math/ratios.js";
import { Scaled, moderate, pow } from "../math/scaled.js";

const PI_MU0 = Math.PI * MU0; // two roundings: within 1 ulp of pi mu0
/** 100 omega eps0 per hertz: conduction current must exceed displacement current a hundredfold. */
export const GOOD_CONDUCTOR_PER_HZ = 100 * 2 * Math.PI * EPSILON0;
/** Loss density above which a core runs hot, W/m^3 (500 mW/cm^3; common practice). */
export const HOT_CORE_DENSITY = 500e3;
const ONE = /* @__PURE__ */ Scaled.of(1);

/**
 * Skin depth of a good conductor.
 *
 * delta = 1 / sqrt(pi * f * mu0 * mur * sigma), with delta in m, f in Hz, sigma the
 * conductivity in S/m, mur the conductor's relative permeability. From the diffusion
 * equation that Faraday's and Ampere's laws give inside a conductor when conduction
 * current dominates displacement current.
 *
 * Validity: good conductor (sigma >> 2 pi f eps0; warning below 100 times); plane surface,
 * or a conductor whose radius is several skin depths. Any relative permeability
 * above 0 is accepted (copper is diamagnetic, mur = 0.999994).
 *
 * Accuracy: within 3 ulp for every input whose result is a double (measured by
 * tests/flux/extremes-accuracy.test.ts).
 *
 * Reference: J. D. Jackson, Classical Electrodynamics, 3rd ed. (1999), eq. (5.165)
 * (equation number from memory); copper conductivity 58.0 MS/m is the IEC 60028
 * International Annealed Copper Standard.
 *
 * @example
 * skinDepth({ conductivity: quantity(58, "MS/m"), frequency: quantity(60, "Hz") }); // ≈ 8.53 mm
 */
export const skinDepth = /* @__PURE__ */ defineFormula({
  id: "skinDepth",
  title: "Skin depth",
  category: "magnetic field",
  description: "Depth at which an AC field or current density in a good conductor falls to 1/e of its surface value.",
  equation: "delta = 1 / sqrt(pi * f * mu0 * mur * sigma)",
  inputs: [
    { name: "conductivity", dimension: "Conductivity", description: "Electrical conductivity of the conductor (copper, IEC 60028: 58.0 MS/m)", domain: POSITIVE, example: 58e6 },
    { name: "frequency", dimension: "Frequency", description: "Frequency of the current or field", domain: POSITIVE, example: 100e3 },
    { name: "relativePermeability", ...RELATIVE_PERMEABILITY, description: "Relative permeability of the conductor (1 for copper and aluminium; copper is 0.999994)", example: 1 },
  ],
  output: { dimension: "Length", description: "Skin depth" },
  validity: [
    {
      code: "not_a_good_conductor",
      // Conduction current must dominate displacement current: sigma / (omega eps0) >> 1.
      when: (x) => x.conductivity < GOOD_CONDUCTOR_PER_HZ * x.frequency,
      measure: (x) => cappedRatio(GOOD_CONDUCTOR_PER_HZ * x.frequency, x.conductivity),
      message: "conductivity is below 100 times omega * eps0: displacement current is not negligible and the good-conductor skin depth no longer applies",
    },
  ],
  source: [
    { authors: "J. D. Jackson", year: 1999, title: "Classical Electrodynamics, 3rd ed.", locator: "sec. 5.18, eq. (5.165) (from memory)" },
    { authors: "IEC", year: 1925, title: "IEC 60028: International standard of resistance for copper", locator: "annealed copper 58.0 MS/m at 20 degC (year from memory)" },
  ],
  // Product of positive factors then one sqrt: no cancellation. Plain when every factor is moderate;
  // otherwise the product is held as mantissa and exponent (1e20 S/m at 1e300 Hz gives 5e-168 m,
  // although the product itself overflows).
  compute: (x) =>
    moderate(x.frequency) && moderate(x.relativePermeability) && moderate(x.conductivity)
      ? 1 / Math.sqrt(PI_MU0 * x.frequency * x.relativePermeability * x.conductivity)
      : ONE.div(Scaled.of(PI_MU0).times(x.frequency).times(Scaled.of(x.relativePermeability).times(x.conductivity)).sqrt()).toNumber(),
});

/** The material's Steinmetz parameters k, alpha, beta as inputs, in calling order: one declaration for every core-loss formula. */
export const STEINMETZ_PARAMETERS = [
  { name: "coefficient", dimension: "Dimensionless", description: "Steinmetz coefficient k, in W/m^3 for f in Hz and B in T", domain: POSITIVE, example: 1.5 },
  { name: "frequencyExponent", dimension: "Dimensionless", description: "Frequency exponent alpha (typically 1 to 2)", domain: POSITIVE, example: 1.4 },
  { name: "fluxExponent", dimension: "Dimensionless", description: "Flux-density exponent beta (typically 2 to 3)", domain: POSITIVE, example: 2.5 },
] as const;

/** The core's effective volume as an input of the core-loss formulas. */
export const CORE_VOLUME = { name: "volume", dimension: "Volume", description: "Effective core volume V_e", domain: POSITIVE, example: 5e-6 } as const;

/** The Steinmetz exponents as a formula's inputs hold them (coreLoss, coreLossForWaveform). */
interface SteinmetzExponents {
  readonly frequencyExponent: number;
  readonly fluxExponent: number;
}

/** Steinmetz exponents far outside what fitted materials show: a sign of a unit mix-up. Shared by the core-loss formulas. */
export const STEINMETZ_EXPONENTS = {
  code: "unusual_exponents",
  when: (x: SteinmetzExponents): boolean => x.frequencyExponent < 1 || x.frequencyExponent > 3 || x.fluxExponent < 1.5 || x.fluxExponent > 3.5,
  // How far outside its usual range the worse exponent lies, as a ratio (> 1 when warned).
  measure: (x: SteinmetzExponents): number =>
    Math.max(cappedRatio(1, x.frequencyExponent), x.frequencyExponent / 3, cappedRatio(1.5, x.fluxExponent), x.fluxExponent / 3.5),
  message: "exponents outside the usual ranges (alpha 1 to 3, beta 1.5 to 3.5; common practice): check the coefficients' units (f in Hz, B in T, k in W/m^3)",
} as const;

/** A core loss (W) over its volume above the hot-core density. Shared by the core-loss formulas. */
export const HOT_CORE = {
  code: "hot_core",
  // ~100-300 kW/m^3 (100-300 mW/cm^3) is a usual ferrite design range for a ~40 K rise (common practice).
  when: (x: { readonly volume: number }, p: number | readonly number[]): boolean => cappedRatio(p as number, x.volume) > HOT_CORE_DENSITY,
  measure: (x: { readonly volume: number }, p: number | readonly number[]): number => cappedRatio(p as number, x.volume),
  message: (x: { readonly volume: number }, p: number | readonly number[]): string =>
    `loss density ${formatNumber(cappedRatio(p as number, x.volume) / 1e3, 3)} kW/m^3 (mW/cm^3) is above about 500 kW/m^3, where a core in still air ` +
    "runs well beyond a 40 K rise (common practice): burn risk, ferrite losses rise again above their minimum temperature, possible thermal runaway; " +
    `check the temperature rise. ${GOVERN}`,
} as const;

/**
 * Core loss by the Steinmetz equation.
 *
 * P = k * f^alpha * B^beta * V, with P in W, f in Hz, B the peak flux density in T,
 * V the core volume in m^3, and k, alpha, beta fitted to the material's loss curves.
 * k is a plain number in the units those fix: W/m^3 when f is in Hz and B in T
 * (convert datasheet fits made in kHz, mT or mW/cm^3 before use).
 *
 * Assumptions (stated in the description, not warned on every call): sinusoidal
 * flux, and only within the frequency and flux range the coefficients were fitted
 * over; DC bias and temperature change the loss. Warns when the exponents are
 * outside their usual ranges (a sign of a unit mix-up).
 *
 * Accuracy: within 4 ulp for every input whose result is a double, including those
 * where f^alpha or B^beta alone overflows or underflows, for exponents up to 2000
 * (measured by tests/flux/extremes-accuracy.test.ts); within 12 ulp for exponents up
 * to 8000, and about |exponent| / 500 ulp beyond (no fitted material comes near).
 *
 * Reference: C. P. Steinmetz, "On the law of hysteresis", Trans. AIEE 9 (1892) 3-64
 * (B^1.6 law); the frequency-exponent form as used in C. W. T. McLyman, Transformer
 * and Inductor Design Handbook, 3rd ed. (2004), core loss (from memory).
 *
 * @example
 * coreLoss({ coefficient: 1.5, frequencyExponent: 1.4, fluxExponent: 2.5, frequency: quantity(100, "kHz"), peakFluxDensity: quantity(0.1, "T"), volume: quantity(5, "cm^3") }); // ≈ 0.24 W
 */
export const coreLoss = /* @__PURE__ */ defineFormula({
  id: "coreLoss",
  title: "Core loss (Steinmetz equation)",
  category: "flux",
  description:
    "Power lost in a magnetic core under sinusoidal excitation, from the material's Steinmetz coefficients. " +
    "Holds for sinusoidal excitation within the frequency and flux-density range the coefficients were fitted over; " +
    "other waveforms, DC bias and temperature change the loss.",
  equation: "P = k * f^alpha * B^beta * V  (k in W/m^3 with f in Hz, B in T)",
  inputs: [
    ...STEINMETZ_PARAMETERS,
    { name: "frequency", dimension: "Frequency", description: "Excitation frequency", domain: POSITIVE, example: 100e3 },
    { name: "peakFluxDensity", dimension: "FluxDensity", description: "Peak flux density (half the peak-to-peak swing)", domain: NON_NEGATIVE, example: 0.1 },
    CORE_VOLUME,
  ],
  output: { dimension: "Power", description: "Core loss" },
  validity: [STEINMETZ_EXPONENTS],
  cautions: [HOT_CORE],
  source: [
    { authors: "C. P. Steinmetz", year: 1892, title: "On the law of hysteresis, Trans. AIEE 9, 3-64" },
    { authors: "C. W. T. McLyman", year: 2004, title: "Transformer and Inductor Design Handbook, 3rd ed.", locator: "core loss (chapter not checked; from memory)" },
  ],
  // Math.pow is within an ulp for positive bases. Plain when both powers and the other factors are
  // moderate; otherwise each power is held as mantissa and exponent (see src/math/scaled.ts `pow`), so a
  // B^beta that alone underflows still gives its representable product.
  compute: (x) => {
    if (x.peakFluxDensity === 0) return 0;
    const fa = Math.pow(x.frequency, x.frequencyExponent);
    const bb = Math.pow(x.peakFluxDensity, x.fluxExponent);
    // fa, bb > 0 excludes a power that underflowed to zero (moderate counts an exact zero as moderate).
    if (moderate(x.coefficient) && fa > 0 && moderate(fa) && bb > 0 && moderate(bb) && moderate(x.volume)) return x.coefficient * fa * bb * x.volume;
    const p = Scaled.of(x.coefficient).times(pow(x.frequency, x.frequencyExponent)).times(pow(x.peakFluxDensity, x.fluxExponent).times(x.volume));
    return p.toNumber();
  },
});
