import { defineFormula } from "../core/formula.js";
import { formatNumber } from "../core/format.js";
import { POSITIVE, TURNS } from "../core/spec.js";
import { cappedRatio } from "../math/ratios.js";
import { scaledProduct } from "../math/scaled.js";
import { storedEnergyCaution } from "../inductance/circuit.js";

/**
 * Window utilisation (bare copper area over window area) above which a round-wire winding on a
 * bobbin is hard to wind: McLyman designs with 0.4 and calls it a good practical value; above about
 * 0.5 only careful machine winding or rectangular conductors get there (common practice).
 */
const PRACTICAL_FILL = 0.5;
/** Waveform factor of a square wave, K_f = 4 (form factor 1): no symmetric AC voltage has less. */
const SQUARE_WAVE_FACTOR = 4;

const MCLYMAN = { authors: "C. W. T. McLyman", year: 2004, title: "Transformer and Inductor Design Handbook, 3rd ed." } as const;

/** The window utilisation input, shared by both area products. */
const WINDOW_UTILIZATION = {
  name: "windowUtilization",
  dimension: "Dimensionless",
  description: "Window utilisation K_u: bare copper area over window area (McLyman designs with 0.4)",
  domain: { min: 0, minExclusive: true, max: 1 },
  example: 0.4,
} as const;

const HIGH_UTILIZATION = {
  code: "above_practical_fill",
  when: (x: { windowUtilization: number }) => x.windowUtilization > PRACTICAL_FILL,
  measure: (x: { windowUtilization: number }) => x.windowUtilization / PRACTICAL_FILL,
  message: (x: { windowUtilization: number }) =>
    `window utilisation ${formatNumber(x.windowUtilization, 3)} is above about 0.5, more than a round-wire winding on a bobbin usually reaches (McLyman designs with 0.4; common practice): ` +
    "the core found may be too small to wind",
} as const;

/**
 * Area product Ap = W_a A_c a transformer core needs, by McLyman's method.
 *
 * Ap = P_t / (K_f K_u B f J), Ap in m^4: P_t the apparent power in W (the sum of the volt-amperes of
 * all windings, e.g. P_o (1 + 1/eta) for one primary and one secondary), K_f the waveform factor
 * (4.44 sine, 4.0 square), K_u the window utilisation, B the peak flux density in T, f the frequency
 * in Hz and J the current density in A/m^2. From Faraday's law, V = K_f N f B A_c for each winding,
 * and the window holding every winding's copper, K_u W_a = sum N I / J. McLyman writes it
 * Ap = P_t 1e4 / (K_o K_f B_ac f J) cm^4 with J in A/cm^2.
 *
 * A sizing method: choose a core with at least this Ap, then check its temperature rise, regulation
 * and flux. Warnings: a waveform factor below 4 (no symmetric AC voltage has a form factor below 1:
 * a sign of a mistake) and window utilisation above 0.5 (common practice).
 *
 * Accuracy: within 4 ulp (scaled product and quotient).
 *
 * Reference: C. W. T. McLyman, Transformer and Inductor Design Handbook, 3rd ed. (2004), power
 * transformer design, area product Ap = P_t 1e4 / (K_o K_f B_ac f J) (chapter and equation number
 * from memory).
 *
 * @example
 * areaProduct({ apparentPower: quantity(210, "W"), waveformFactor: 4, windowUtilization: 0.4, peakFluxDensity: quantity(0.15, "T"), frequency: quantity(100, "kHz"), currentDensity: quantity(4, "A/mm^2") }); // ≈ 0.219 cm^4
 */
export const areaProduct = /* @__PURE__ */ defineFormula({
  id: "areaProduct",
  title: "Transformer core area product (McLyman's method)",
  category: "winding",
  description:
    "Area product W_a A_c (window area times core cross-section) a transformer core needs for an apparent power, by McLyman's method: " +
    "Faraday's law for the flux and the window's copper for the current. A sizing start; temperature rise and regulation are checked after.",
  equation: "Ap = P_t / (K_f K_u B f J)",
  inputs: [
    { name: "apparentPower", dimension: "Power", description: "Apparent power P_t: the volt-amperes of all windings together", domain: POSITIVE, example: 210 },
    { name: "waveformFactor", dimension: "Dimensionless", description: "Waveform factor K_f: 4.44 for a sine wave, 4.0 for a square wave", domain: POSITIVE, example: 4 },
    WINDOW_UTILIZATION,
    { name: "peakFluxDensity", dimension: "FluxDensity", description: "Peak operating flux density B_ac", domain: POSITIVE, example: 0.15 },
    { name: "frequency", dimension: "Frequency", description: "Operating frequency", domain: POSITIVE, example: 100e3 },
    { name: "currentDensity", dimension: "CurrentDensity", description: "Current density J in the windings", domain: POSITIVE, example: 4e6 },
  ],
  output: { dimension: "AreaProduct", description: "Area product W_a A_c the core needs" },
  validity: [
    {
      code: "waveform_factor_below_square_wave",
      when: (x) => x.waveformFactor < SQUARE_WAVE_FACTOR,
      measure: (x) => cappedRatio(SQUARE_WAVE_FACTOR, x.waveformFactor),
      message: (x) =>
        `waveform factor ${formatNumber(x.waveformFactor, 3)} is below 4, the square wave's: no symmetric AC voltage has a lower one (form factor at least 1); ` +
        "K_f is 4 times the form factor (4.44 sine, 4.0 square)",
    },
    HIGH_UTILIZATION,
  ],
  source: { ...MCLYMAN, locator: "power transformer design, Ap = P_t 1e4 / (K_o K_f B_ac f J) cm^4 with J in A/cm^2 (chapter and equation number from memory)" },
  // Six factors, no sums: a plain quotient while every step stays a normal double, scaled otherwise.
  compute: (x) => scaledProduct([x.apparentPower], [x.waveformFactor, x.windowUtilization, x.peakFluxDensity, x.frequency, x.currentDensity]),
});

/**
 * Area product Ap = W_a A_c an inductor core needs to store an energy, by McLyman's method.
 *
 * Ap = 2 W / (B J K_u), Ap in m^4: W = L I^2 / 2 the peak stored energy in J, B the peak flux density
 * in T, J the current density in A/m^2 and K_u the window utilisation. From L I = N B A_c and
 * N I = K_u W_a J. McLyman writes it Ap = 2 (Energy) 1e4 / (B_m J K_u) cm^4 with J in A/cm^2.
 *
 * A sizing method, as areaProduct. Caution: an inductor storing 20 J or more is an energy hazard
 * (IEC 60950-1 hazardous energy level, from memory).
 *
 * Accuracy: within 3 ulp.
 *
 * Reference: C. W. T. McLyman, Transformer and Inductor Design Handbook, 3rd ed. (2004), DC inductor
 * design, Ap = 2 (Energy) 1e4 / (B_m J K_u) (chapter and equation number from memory).
 *
 * @example
 * inductorAreaProduct({ energy: quantity(2, "mJ"), peakFluxDensity: quantity(0.3, "T"), currentDensity: quantity(4, "A/mm^2"), windowUtilization: 0.4 }); // ≈ 0.833 cm^4
 */
export const inductorAreaProduct = /* @__PURE__ */ defineFormula({
  id: "inductorAreaProduct",
  title: "Inductor core area product (McLyman's method)",
  category: "winding",
  description:
    "Area product W_a A_c (window area times core cross-section) an inductor core needs to store an energy, by McLyman's method: " +
    "the flux for L I and the window's copper for the current. A sizing start; gap, temperature rise and saturation are checked after.",
  equation: "Ap = 2 W / (B J K_u)",
  inputs: [
    { name: "energy", dimension: "Energy", description: "Peak stored energy L I^2 / 2", domain: POSITIVE, example: 2e-3 },
    { name: "peakFluxDensity", dimension: "FluxDensity", description: "Peak flux density B_m in the core", domain: POSITIVE, example: 0.3 },
    { name: "currentDensity", dimension: "CurrentDensity", description: "Current density J in the winding", domain: POSITIVE, example: 4e6 },
    WINDOW_UTILIZATION,
  ],
  output: { dimension: "AreaProduct", description: "Area product W_a A_c the core needs" },
  validity: [HIGH_UTILIZATION],
  cautions: [storedEnergyCaution((x: { energy: number }) => x.energy)],
  source: { ...MCLYMAN, locator: "DC inductor design, Ap = 2 (Energy) 1e4 / (B_m J K_u) cm^4 with J in A/cm^2 (chapter and equation number from memory)" },
  compute: (x) => scaledProduct([2, x.energy], [x.peakFluxDensity, x.currentDensity, x.windowUtilization]),
});

/**
 * Window fill (utilisation) of a winding: bare copper area over the core's window area.
 *
 * K_u = N A_w / W_a, dimensionless: N turns of a conductor of bare area A_w (all parallel strands
 * together) in m^2, W_a the window area in m^2 (for several windings, add their fill factors).
 *
 * Warnings: above 0.5, more than a round-wire winding on a bobbin usually reaches (McLyman designs
 * with 0.4; common practice); above 1, the copper alone is larger than the window and cannot fit.
 *
 * Accuracy: within 2 ulp.
 *
 * Reference: C. W. T. McLyman, Transformer and Inductor Design Handbook, 3rd ed. (2004), window
 * utilisation factor K_u (chapter from memory); the 0.5 limit is common practice.
 *
 * @example
 * windowFillFactor({ turns: 40, wireArea: quantity(0.5, "mm^2"), windowArea: quantity(60, "mm^2") }); // ≈ 0.333
 */
export const windowFillFactor = /* @__PURE__ */ defineFormula({
  id: "windowFillFactor",
  title: "Window fill factor of a winding",
  category: "winding",
  description: "Fraction of a core's window filled by the bare copper of a winding (window utilisation K_u): turns times conductor area over window area.",
  equation: "K_u = N A_w / W_a",
  inputs: [
    { name: "turns", ...TURNS, example: 40 },
    { name: "wireArea", dimension: "Area", description: "Bare conductor area of one turn (all parallel strands)", domain: POSITIVE, example: 0.5e-6 },
    { name: "windowArea", dimension: "Area", description: "Window area W_a of the core (or of the bobbin)", domain: POSITIVE, example: 60e-6 },
  ],
  output: { dimension: "Dimensionless", description: "Window fill factor K_u" },
  validity: [
    {
      code: "above_practical_fill",
      when: (_x, k) => (k as number) > PRACTICAL_FILL,
      measure: (_x, k) => (k as number) / PRACTICAL_FILL,
      message: (_x, k) =>
        `fill ${formatNumber(k as number, 3)} is above about 0.5, more than a round-wire winding on a bobbin usually reaches (McLyman designs with 0.4; common practice): ` +
        "check that it can be wound",
    },
    {
      code: "exceeds_window",
      when: (_x, k) => (k as number) > 1,
      measure: (_x, k) => k as number,
      message: (_x, k) => `the bare copper is ${formatNumber(k as number, 3)} times the window area: the winding cannot fit`,
    },
  ],
  source: { ...MCLYMAN, locator: "window utilisation factor K_u (chapter from memory); fill limit common practice" },
  compute: (x) => scaledProduct([x.turns, x.wireArea], [x.windowArea]),
});
