import { defineFormula } from "../core/formula.js";
import { formatNumber } from "../core/format.js";
import { GOVERN } from "../core/hazards.js";
import { POSITIVE } from "../core/spec.js";
import { moderate, pow, Scaled } from "../math/scaled.js";
import { CATEGORY, HOT_TRACE_RISE } from "./shared.js";

/** The fit's exponents: of the temperature rise (K) and of the cross-section (square mils). */
const RISE_EXPONENT = 0.44;
const AREA_EXPONENT = 0.725;
/** The fit's coefficients, A per K^0.44 per mil^1.45: external layers; internal ones carry half. */
const EXTERNAL = 0.048;
const INTERNAL = 0.024;
/** One mil (0.001 in) in m. */
const MIL = 25.4e-6;
/** The coefficients for SI lengths: k / mil^1.45 (one rounding each, once). */
const SI_FACTOR = 1 / Math.pow(MIL, 2 * AREA_EXPONENT);
/** The charts the fit was made from (from memory): rises 10-100 K, up to 700 square mils, widths up to 400 mil. */
const RISE_LOW = 10;
const RISE_HIGH = 100;
const AREA_HIGH = 700 * MIL * MIL;
const WIDTH_HIGH = 400 * MIL;
/** Chart tops: 35 A for external conductors, half that for internal ones (from memory). */
const CURRENT_HIGH = { external: 35, internal: 17.5 } as const;

interface X {
  readonly width: number;
  readonly thickness: number;
  readonly temperatureRise: number;
  readonly layer: "external" | "internal";
}

/** w t in m^2 without overflow or underflow (capped at Infinity, which only compares). */
const area = (x: X) => (moderate(x.width) && moderate(x.thickness) ? x.width * x.thickness : Scaled.of(x.width).times(x.thickness).toNumber());

/**
 * Current a copper trace carries for a given temperature rise, by the curve
 * fit to the design charts of IPC-2221 (conductor sizing for current):
 *   I = k dT^0.44 A^0.725,
 * I in A, dT the temperature rise in K, A = w t the cross-section in square mils
 * (the formula converts from SI: 1 mil = 25.4 um), k = 0.048 for external
 * (outer-layer) conductors and 0.024 for internal ones. The fit is the standard's
 * own summary of charts that go back to measurements of the 1950s; IPC-2152 (2009)
 * replaced those charts with new measured data that depend on board thickness,
 * copper planes and layer, and finds internal conductors in many boards cooler
 * than the old charts assume: for a design that matters, use IPC-2152.
 *
 * Assumptions: a single trace in still air on a board without nearby copper
 * planes, steady DC (or RMS) current. The rise is a temperature difference:
 * give it in K ("10 K"); a unit string in degC is read as an absolute temperature.
 * Warned outside the charts' range (rises 10-100 K, up to 700 square mils,
 * widths up to 400 mil, currents up to 35 A external / 17.5 A internal; from memory).
 *
 * Reference: IPC-2221B, Generic Standard on Printed Board Design (2012),
 * sec. 6.2, conductor current capacity and the curve fit to its Figure 6-4
 * (clause and figure numbers from memory).
 *
 * @example
 * traceCurrentForTemperatureRise({ width: quantity(1, "mm"), thickness: quantity(35, "um"), temperatureRise: quantity(10, "K") }); // ≈ 2.4 A
 */
export const traceCurrentForTemperatureRise = /* @__PURE__ */ defineFormula({
  id: "traceCurrentForTemperatureRise",
  title: "Trace current for a temperature rise (IPC-2221 curve fit)",
  category: CATEGORY,
  description:
    "Current a copper printed-board trace carries for a given temperature rise, by the IPC-2221 curve fit to its conductor-sizing charts " +
    "(external or internal layer); IPC-2152 (2009) supersedes these charts with newer measured data, which should be used where it matters.",
  equation: "I = k dT^0.44 A^0.725  (I in A, dT in K, A = w t in square mils; k = 0.048 external, 0.024 internal)",
  inputs: [
    { name: "width", dimension: "Length", description: "Width of the trace", domain: POSITIVE, example: 1e-3 },
    { name: "thickness", dimension: "Length", description: "Thickness of the copper", domain: POSITIVE, example: 3.5e-5 },
    { name: "temperatureRise", dimension: "Temperature", description: "Allowed temperature rise of the trace above ambient (a difference, in K)", domain: POSITIVE, example: 10 },
    {
      name: "layer", choices: ["external", "internal"], description: "Conductor on an outer layer (external) or inside the board (internal)",
      default: "external", example: "external",
    },
  ],
  output: { dimension: "Current", description: "Current for that temperature rise" },
  validity: [
    {
      code: "rise_range",
      when: (x) => x.temperatureRise < RISE_LOW || x.temperatureRise > RISE_HIGH,
      measure: (x) => Math.max(RISE_LOW / x.temperatureRise, x.temperatureRise / RISE_HIGH),
      message: (x) =>
        `a rise of ${formatNumber(x.temperatureRise, 3)} K lies outside the 10-100 K of the IPC-2221 charts the fit summarises (from memory): the current is extrapolated` +
        (x.temperatureRise > 273 ? "; a rise above 273 K usually means an absolute temperature was given in degC: give the rise in K" : ""),
    },
    {
      code: "size_range",
      when: (x) => area(x) > AREA_HIGH || x.width > WIDTH_HIGH,
      measure: (x) => Math.max(area(x) / AREA_HIGH, x.width / WIDTH_HIGH),
      message: (x) =>
        `the trace is ${formatNumber(x.width / MIL, 3)} mil wide with ${formatNumber(area(x) / (MIL * MIL), 3)} square mils of copper; the IPC-2221 charts stop at 400 mil and 700 square mils (from memory): the current is extrapolated`,
    },
    {
      code: "current_range",
      when: (x, i) => (i as number) > CURRENT_HIGH[x.layer],
      measure: (x, i) => (i as number) / CURRENT_HIGH[x.layer],
      message: (x, i) =>
        `${formatNumber(i as number, 3)} A is above the ${formatNumber(CURRENT_HIGH[x.layer])} A top of the IPC-2221 chart for ${x.layer} conductors (from memory): the current is extrapolated`,
    },
  ],
  cautions: [
    {
      code: "hot_trace",
      when: (x) => x.temperatureRise > HOT_TRACE_RISE,
      measure: (x) => x.temperatureRise,
      message: (x) =>
        `a rise of ${formatNumber(x.temperatureRise, 3)} K puts the trace above about 70 degC in a 25 degC room: brief contact can burn ` +
        "(touch-temperature limits, e.g. IEC 62368-1; from memory), and near hot parts the board may pass its laminate's rated operating temperature; " +
        "the IPC-2221 fit is not a thermal design, use IPC-2152 and measure. " +
        GOVERN,
    },
  ],
  // I ~ (w t)^0.725 with w, t ~ size (the rise is not a size): size^1.45 under geometric similarity.
  geometricExponent: 2 * AREA_EXPONENT,
  source: {
    authors: "IPC",
    year: 2012,
    title: "IPC-2221B: Generic Standard on Printed Board Design",
    locator: "sec. 6.2 conductor current capacity, curve fit I = k dT^0.44 A^0.725 to Figure 6-4, k = 0.048 external, 0.024 internal (clause and figure numbers from memory)",
  },
  // Plain powers while the inputs are moderate (w/mil, t/mil and dT each within 2^+-160: no
  // product overflows); otherwise each power as a scaled value (src/math/scaled.ts `pow`, exponents
  // exact), so a representable current comes back even when w t alone would overflow.
  compute: (x) => {
    const k = x.layer === "internal" ? INTERNAL : EXTERNAL;
    if (moderate(x.width) && moderate(x.thickness) && moderate(x.temperatureRise)) {
      return k * Math.pow(x.temperatureRise, RISE_EXPONENT) * Math.pow((x.width / MIL) * (x.thickness / MIL), AREA_EXPONENT);
    }
    return pow(x.width, AREA_EXPONENT).times(pow(x.thickness, AREA_EXPONENT)).times(pow(x.temperatureRise, RISE_EXPONENT)).times(k * SI_FACTOR).toNumber();
  },
});
