import { formatEngineering, formatPrefixed } from "./number-format.js";

// Units that read well with an SI prefix chosen by mathjs ("8.854 pF", "100 mm^2").
// Compound units ("F/m") and the kilogram (whose prefixes mathjs would put on "g") are
// printed in engineering notation instead ("320e-9 F/m").
const PREFIXABLE = new Set([
  "m", "m^2", "m^3", "s", "Hz", "A", "V", "ohm", "S", "F", "H", "Wb", "T", "N", "J", "W", "C", "Pa", "rad",
]);

/** Engineering notation without a trailing "e+0": "320e-9", "1.235e+3", "4.4". */
export function engineering(v: number, precision = 4): string {
  if (v === 0 || !Number.isFinite(v)) return String(v);
  const s = formatEngineering(v, precision);
  return s.replace(/e\+0$/, "").replace(/(\.\d*?)0+(e|$)/, "$1$2").replace(/\.(e|$)/, "$1");
}

/**
 * A value in SI with its unit, written for people: an SI prefix where it reads
 * well, engineering notation otherwise. `precision` significant digits.
 */
export function formatQuantity(v: number, unit: string, precision = 4): string {
  if (!unit) {
    // Pure numbers (turns, ratios) read best plain in the usual range: "1000", "4.4".
    const m = Math.abs(v);
    return m >= 1e-3 && m < 1e6 ? String(Number(v.toPrecision(precision))) : engineering(v, precision);
  }
  const mag = Math.abs(v);
  if (PREFIXABLE.has(unit) && mag >= 1e-24 && mag < 1e27) {
    return formatPrefixed(v, unit, precision);
  }
  return `${engineering(v, precision)} ${unit}`;
}

/** Full-precision SI for a second column: "3.8958426402720006e-11 F". */
export function formatSI(v: number, unit: string): string {
  return unit ? `${v} ${unit}` : String(v);
}

/** "38.96 pF   (3.8958426402720006e-11 F)": readable, then full SI when that says more. */
export function formatBoth(v: number, unit: string, precision = 4): string {
  const a = formatQuantity(v, unit, precision);
  const b = formatSI(v, unit);
  return a === b ? a : `${a}   (${b})`;
}
