import { defineFormula } from "../core/formula.js";
import { voltageCautions } from "../core/hazards.js";
import { NON_NEGATIVE, POSITIVE, TURNS } from "../core/spec.js";
import { formatNumber } from "../core/format.js";
import { cappedRatio } from "../math/ratios.js";
import { moderate, scaledProduct } from "../math/scaled.js";

/** sqrt(2) pi = 4.44288..., the "4.44" of the transformer equation (0.5 ulp: 4.442882938158366 is its nearest double). */
const SQRT2_PI = 4.442882938158366;

const GRIFFITHS = { authors: "D. J. Griffiths", year: 2013, title: "Introduction to Electrodynamics, 4th ed. (Pearson; reissued by Cambridge University Press, 2017)" } as const;

const TRANSFORMER_SOURCE = [
  { authors: "C. W. T. McLyman", year: 2004, title: "Transformer and Inductor Design Handbook, 3rd ed.", locator: "Faraday's law, E = 4.44 B_ac f A_c N for a sine wave (chapter not checked; from memory)" },
  { ...GRIFFITHS, locator: "sec. 7.2.1, Faraday's law (from memory)" },
] as const;

/**
 * Magnetic flux of a uniform field through a flat surface.
 *
 * Phi = B * A * cos(theta), with Phi in Wb, B the flux density in T, A the area
 * in m^2 and theta (rad) the angle between B and the surface normal.
 *
 * Validity: B uniform over the surface and the surface flat.
 *
 * Reference: D. J. Griffiths, Introduction to Electrodynamics, 4th ed. (2013), sec. 7.1.3 (from memory).
 *
 * @example
 * magneticFlux({ fluxDensity: quantity(0.2, "T"), area: quantity(1, "cm^2") }); // ≈ 2e-5 Wb
 */
export const magneticFlux = /* @__PURE__ */ defineFormula({
  id: "magneticFlux",
  title: "Magnetic flux through a flat surface",
  category: "flux",
  description: "Flux of a uniform flux density through a flat surface tilted by an angle from the field.",
  equation: "Phi = B * A * cos(theta)",
  inputs: [
    { name: "fluxDensity", dimension: "FluxDensity", description: "Magnitude of the (uniform) flux density", example: 0.2 },
    { name: "area", dimension: "Area", description: "Area of the flat surface", domain: NON_NEGATIVE, example: 1e-4 },
    { name: "angle", dimension: "Angle", description: "Angle between the field and the surface normal", default: 0, example: 0.5 },
  ],
  output: { dimension: "MagneticFlux", description: "Magnetic flux through the surface" },
  source: { ...GRIFFITHS, locator: "sec. 7.1.3 (flux through a loop; section from memory)" },
  // cos of the angle as given (cos(pi/2) ~ 6e-17 is a representation limit of pi/2, not an error).
  // The plain product rounds twice; scaled where it could overflow or underflow on the way.
  compute: (x) => {
    const c = Math.cos(x.angle);
    return moderate(x.fluxDensity) && moderate(x.area) && moderate(c) ? x.fluxDensity * x.area * c : scaledProduct([x.fluxDensity, x.area, c]);
  },
});

/**
 * RMS voltage induced in a winding by a sinusoidal flux (the transformer equation).
 *
 * E = sqrt(2) * pi * f * N * A * B = 4.44 f N A B, with E the rms EMF in V, f in Hz,
 * N turns, A the core's effective cross-section in m^2, B the peak flux density in T.
 *
 * Assumes a sinusoidal flux (form factor 1.11) and that all flux links every turn
 * (leakage neglected); for square-wave drive the factor is 4 instead of 4.44.
 * The result is an a.c. r.m.s. voltage: it is checked against the a.c. r.m.s.
 * voltage bands (above 50 V: `above_extra_low_voltage`; above 1000 V: `high_voltage`).
 *
 * Reference: C. W. T. McLyman, Transformer and Inductor Design Handbook, 3rd ed. (2004) (from memory).
 *
 * @example
 * transformerEmf({ frequency: quantity(50, "Hz"), turns: 100, area: quantity(10, "cm^2"), peakFluxDensity: quantity(1.2, "T") }); // ≈ 26.7 V
 */
export const transformerEmf = /* @__PURE__ */ defineFormula({
  id: "transformerEmf",
  title: "Transformer EMF (rms) from peak flux density",
  category: "flux",
  description:
    "RMS voltage induced in N turns by a sinusoidal flux of given peak density in a core of given area. " +
    "Assumes a sinusoidal flux (form factor 1.11) linking every turn; for square-wave drive use 4 f N A B instead of 4.44 f N A B.",
  equation: "E_rms = sqrt(2) * pi * f * N * A * B_peak  (= 4.44 f N A B)",
  inputs: [
    { name: "frequency", dimension: "Frequency", description: "Frequency of the sinusoidal flux", domain: POSITIVE, example: 50 },
    { name: "turns", ...TURNS, example: 100 },
    { name: "area", dimension: "Area", description: "Effective cross-section of the core", domain: POSITIVE, example: 1e-3 },
    { name: "peakFluxDensity", dimension: "FluxDensity", description: "Peak flux density in the core", domain: NON_NEGATIVE, example: 1.2 },
  ],
  output: { dimension: "Voltage", description: "RMS induced voltage" },
  // The result is r.m.s.: compared with the a.c. r.m.s. bands as it stands.
  cautions: voltageCautions("ac"),
  source: TRANSFORMER_SOURCE,
  // Five positive factors: plain when all are moderate (4 roundings), scaled otherwise.
  compute: (x) =>
    moderate(x.frequency) && moderate(x.turns) && moderate(x.area) && moderate(x.peakFluxDensity)
      ? SQRT2_PI * x.frequency * x.turns * x.area * x.peakFluxDensity
      : scaledProduct([SQRT2_PI, x.frequency, x.turns, x.area, x.peakFluxDensity]),
});

/**
 * Peak flux density in a core driven by a sinusoidal voltage: the transformer
 * equation solved for B, the check a winding designer needs.
 *
 * B = E / (sqrt(2) * pi * f * N * A), with E the rms voltage in V, f in Hz, N turns,
 * A the effective cross-section in m^2, B the peak flux density in T.
 *
 * Optional saturationFluxDensity (T): when given (> 0) a warning is raised if B
 * exceeds it. 0 (the default) means "not given".
 *
 * Reference: C. W. T. McLyman, Transformer and Inductor Design Handbook, 3rd ed. (2004) (from memory).
 *
 * @example
 * transformerPeakFluxDensity({ voltage: quantity(230, "V"), frequency: quantity(50, "Hz"), turns: 800, area: quantity(10, "cm^2") }); // ≈ 1.29 T
 */
export const transformerPeakFluxDensity = /* @__PURE__ */ defineFormula({
  id: "transformerPeakFluxDensity",
  title: "Peak flux density from applied rms voltage",
  category: "flux",
  description:
    "Peak flux density in a core whose winding carries a sinusoidal rms voltage (transformer equation solved for B). " +
    "Assumes a sinusoidal voltage; for a square wave of the same rms use 4 f N A instead of 4.44 f N A.",
  equation: "B_peak = E_rms / (sqrt(2) * pi * f * N * A)",
  inputs: [
    { name: "voltage", dimension: "Voltage", description: "RMS voltage across the winding", domain: NON_NEGATIVE, example: 230 },
    { name: "frequency", dimension: "Frequency", description: "Frequency of the voltage", domain: POSITIVE, example: 50 },
    { name: "turns", ...TURNS, example: 800 },
    { name: "area", dimension: "Area", description: "Effective cross-section of the core", domain: POSITIVE, example: 1e-3 },
    {
      name: "saturationFluxDensity",
      dimension: "FluxDensity",
      description: "Saturation flux density of the core material; 0 means not given (no check)",
      default: 0,
      domain: NON_NEGATIVE,
      example: 1.6,
    },
  ],
  output: { dimension: "FluxDensity", description: "Peak flux density in the core" },
  validity: [
    {
      code: "saturation",
      when: (x, b) => x.saturationFluxDensity > 0 && (b as number) >= x.saturationFluxDensity,
      measure: (x, b) => cappedRatio(b as number, x.saturationFluxDensity),
      message: (x, b) =>
        `peak flux density ${formatNumber(b as number, 3)} T reaches the given saturation flux density ${formatNumber(x.saturationFluxDensity, 3)} T: ` +
        "the core saturates, magnetising current and core temperature rise steeply; add turns or core area",
    },
  ],
  source: TRANSFORMER_SOURCE,
  // One quotient of five values: plain when all are moderate, scaled otherwise.
  compute: (x) =>
    moderate(x.voltage) && moderate(x.frequency) && moderate(x.turns) && moderate(x.area)
      ? x.voltage / (SQRT2_PI * x.frequency * x.turns * x.area)
      : scaledProduct([x.voltage], [SQRT2_PI, x.frequency, x.turns, x.area]),
});

/**
 * EMF across a straight conductor moving through a uniform field.
 *
 * E = B * l * v, with E in V, B in T, l the conductor length in m and v the
 * speed in m/s; B, the conductor and its velocity mutually perpendicular.
 *
 * The result is a steady (d.c.) voltage while the speed is steady: it is checked
 * against the ripple-free d.c. bands (above 120 V: `above_extra_low_voltage`;
 * above 1500 V: `high_voltage`).
 *
 * Reference: D. J. Griffiths, Introduction to Electrodynamics, 4th ed. (2013), sec. 7.1.3 (from memory).
 *
 * @example
 * motionalEmf({ fluxDensity: quantity(0.5, "T"), length: quantity(0.2, "m"), speed: quantity(10, "m/s") }); // ≈ 1 V
 */
export const motionalEmf = /* @__PURE__ */ defineFormula({
  id: "motionalEmf",
  title: "Motional EMF of a moving conductor",
  category: "flux",
  description: "Voltage across a straight conductor moving at right angles through a uniform flux density.",
  equation: "E = B * l * v",
  inputs: [
    { name: "fluxDensity", dimension: "FluxDensity", description: "Flux density (perpendicular to conductor and motion)", example: 0.5 },
    { name: "length", dimension: "Length", description: "Length of the conductor in the field", domain: POSITIVE, example: 0.2 },
    { name: "speed", dimension: "Velocity", description: "Speed of the conductor across the field", example: 10 },
  ],
  output: { dimension: "Voltage", description: "Induced voltage" },
  // A conductor moving at steady speed gives a d.c. voltage.
  cautions: voltageCautions("dc"),
  source: { ...GRIFFITHS, locator: "sec. 7.1.3, motional emf (section from memory)" },
  compute: (x) =>
    moderate(x.fluxDensity) && moderate(x.length) && moderate(x.speed)
      ? x.fluxDensity * x.length * x.speed
      : scaledProduct([x.fluxDensity, x.length, x.speed]),
});
