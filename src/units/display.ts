import { decimalDigits, formatEngineering, placePoint } from "../core/format.js";

/**
 * Values with units, written for people: the CLI, the notebook and the docs
 * all print through formatQuantity, which uses the library's one number
 * formatter (src/core/format.ts). No mathjs here: printing a result must not
 * load the unit parser.
 */

// SI prefixes by power of ten (BIPM, SI Brochure, 9th ed., 2019, Table 7), spelled as unit
// strings read them back ("u" for micro), so a printed value can be pasted as input.
const PREFIX: Readonly<Record<number, string>> = {
  [-24]: "y", [-21]: "z", [-18]: "a", [-15]: "f", [-12]: "p", [-9]: "n", [-6]: "u", [-3]: "m",
  0: "", 3: "k", 6: "M", 9: "G", 12: "T", 15: "P", 18: "E", 21: "Z", 24: "Y",
};

// Unit symbols that take a prefix, with the range of prefixes that reads well on
// each (nobody writes "ks" or "krad"). Mass is printed in grams ("g", up to "kg").
const PREFIX_RANGE: Readonly<Record<string, readonly [number, number]>> = {
  m: [-24, 3], s: [-24, 0], rad: [-9, 0], g: [-24, 3],
  Hz: [-24, 24], A: [-24, 24], V: [-24, 24], ohm: [-24, 24], S: [-24, 24], F: [-24, 24], H: [-24, 24],
  Wb: [-24, 24], T: [-24, 24], N: [-24, 24], J: [-24, 24], W: [-24, 24], C: [-24, 24], Pa: [-24, 24], eV: [-24, 24],
};

// "m", "m^2", "V/m", "W/m^3", "kg": a prefixable symbol, an optional power 2 or 3, an optional "/..." rest.
const SHAPE = /^([A-Za-z]+)(?:\^([23]))?(\/.+)?$/;

/** Significant digits, or "shortest": the fewest digits that read back as the same double. */
export type Precision = number | "shortest";

const digitsOf = (p: Precision): number | undefined => (p === "shortest" ? undefined : p);

/** Engineering notation of a number without unit: "320e-9", "1.235e3", "4.4". */
export function engineering(v: number, precision: Precision = 4): string {
  return formatEngineering(v, digitsOf(precision));
}

/**
 * A value in SI with its unit, written for people: an SI prefix where it reads
 * well ("8.854 pF", "100 mm^2", "2.5 kV/m", "3 mg" for 3e-6 kg), engineering
 * notation otherwise ("320e-9 V m/s", "20e192 T"). `precision` significant
 * digits (default 4), trailing zeros dropped; "shortest" gives the shortest
 * digits that read back as the same double, for text that is read again (the
 * CLI's "Try:" lines).
 *
 * @example
 * formatQuantity(8.8541878188e-12, "F"); // "8.854 pF"
 * formatQuantity(1e-4, "m^2"); // "100 mm^2"
 */
export function formatQuantity(v: number, unit: string, precision: Precision = 4): string {
  const digits = digitsOf(precision);
  if (!unit) {
    // Pure numbers (turns, ratios) read best plain in the usual range: "1000", "4.4".
    const m = Math.abs(v);
    if (m >= 1e-3 && m < 1e6) return String(digits === undefined ? v : Number(v.toPrecision(digits)));
    return formatEngineering(v, digits);
  }
  if (v === 0 || v - v !== 0) return `${formatEngineering(v, digits)} ${unit}`;
  const shape = SHAPE.exec(unit);
  const mass = shape !== null && shape[1] === "kg";
  const symbol = mass ? "g" : shape?.[1];
  const range = symbol === undefined ? undefined : PREFIX_RANGE[symbol];
  if (shape === null || range === undefined) return `${formatEngineering(v, digits)} ${unit}`;
  const power = shape[2] === undefined ? 1 : Number(shape[2]);
  const d = decimalDigits(v, digits);
  // Kilograms are printed in grams: the decimal exponent moves by 3, the digits stay.
  const e = d.exponent + (mass ? 3 : 0);
  // The prefix p (a multiple of 3) with a mantissa of 1 to 999: 0 <= e - p * power <= 2.
  const p = 3 * Math.floor(e / (3 * power));
  const point = e - p * power;
  if (point > 2 || p < range[0] || p > range[1]) return `${formatEngineering(v, digits)} ${unit}`;
  return `${placePoint(d, point)} ${PREFIX[p]}${symbol}${shape[2] ? `^${shape[2]}` : ""}${shape[3] ?? ""}`;
}

/** Full-precision SI for a second column: "3.8958426402720006e-11 F" (shortest round-trip digits, no "e+"). */
export function formatSI(v: number, unit: string): string {
  const text = String(v).replace("e+", "e");
  return unit ? `${text} ${unit}` : text;
}

/** "38.96 pF   (3.8958426402720006e-11 F)": readable, then full SI when that says more. */
export function formatBoth(v: number, unit: string, precision = 4): string {
  const a = formatQuantity(v, unit, precision);
  const b = formatSI(v, unit);
  return a === b ? a : `${a}   (${b})`;
}
