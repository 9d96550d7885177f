/**
 * Number formatting, the one formatter of the library: warning and caution
 * messages (formatNumber), and through src/units/display.ts the CLI, the
 * notebook and the docs. Short, readable, engineering exponents, never the
 * "1.0e+2" that `toPrecision` gives for round numbers.
 */

/** What a message shows for a value past the largest double (never "Infinity"). */
export const BEYOND_RANGE = "a value beyond the double range";
/** What a message shows for NaN (never "NaN"). */
export const NOT_A_NUMBER = "not a number";

/**
 * A number with `significant` digits (default 2): plain notation between
 * 0.001 and 1e6 ("100", "2.5", "0.012"), engineering notation outside (an
 * exponent that is a multiple of 3: "340e-9", "1.2e9"). Trailing zeros after
 * the point are dropped.
 *
 * Messages never print "Infinity" or "NaN": a non-finite value is shown as
 * words (BEYOND_RANGE, with "minus " before it when negative, or NOT_A_NUMBER).
 * Words and not a thrown error, because a message is built while a result or
 * an error is being reported, and failing there would hide the report.
 *
 * @example
 * formatNumber(100); // "100"
 * formatNumber(0.000123456, 3); // "123e-6"
 * formatNumber(Infinity); // "a value beyond the double range"
 */
export function formatNumber(v: number, significant = 2): string {
  // Zero, NaN and the infinities fall through to formatEngineering below (mag is 0 or NaN).
  const digits = Math.min(21, Math.max(1, Math.round(significant)));
  // Round first: rounding may carry into the next decade (999.6 -> "1.0e+3"),
  // and the rounded value decides the notation. Number() reads either form.
  const rounded = Number(v.toPrecision(digits));
  const mag = Math.abs(rounded);
  if (mag >= 1e-3 && mag < 1e6) return stripZeros(plain(rounded, digits));
  return formatEngineering(v, digits);
}

/**
 * A number in engineering notation: a mantissa from 1 to below 1000 and an
 * exponent that is a multiple of 3, left out when it is 0 ("340e-9", "4.4",
 * "20e192"), with `significant` digits, or with the shortest digits that read
 * back as the same double when `significant` is undefined (for text a program
 * reads again). The digits come from `toExponential` (correctly rounded) and
 * are only moved, never recomputed, so no rounding is added. Non-finite values
 * are words, as in formatNumber.
 *
 * @example
 * formatEngineering(3.4e-7); // "340e-9"
 * formatEngineering(1234.5678, 3); // "1.23e3"
 * formatEngineering(0.1 + 0.2); // "300.00000000000006e-3"
 */
export function formatEngineering(v: number, significant?: number): string {
  if (v !== v) return NOT_A_NUMBER;
  if (v === Infinity) return BEYOND_RANGE;
  if (v === -Infinity) return `minus ${BEYOND_RANGE}`;
  if (v === 0) return "0";
  const d = decimalDigits(v, significant);
  const exponent = 3 * Math.floor(d.exponent / 3);
  const mantissa = placePoint(d, d.exponent - exponent);
  return exponent === 0 ? mantissa : `${mantissa}e${exponent}`;
}

/** The decimal digits of a nonzero finite v: v = sign d.ddd x 10^exponent, no trailing zeros. */
export interface DecimalDigits {
  readonly negative: boolean;
  readonly digits: string;
  readonly exponent: number;
}

/** Correctly rounded significant digits of v (or its shortest round-trip digits), with their exponent. */
export function decimalDigits(v: number, significant?: number): DecimalDigits {
  const n = significant === undefined ? undefined : Math.min(100, Math.max(1, Math.round(significant)));
  const [m, e] = (n === undefined ? v.toExponential() : v.toExponential(n - 1)).split("e") as [string, string];
  const negative = m.startsWith("-");
  const digits = m.replace(/^-/, "").replace(".", "").replace(/0+$/, "") || "0";
  return { negative, digits, exponent: Number(e) };
}

/** The digits with `point` + 1 of them before the decimal point (point from 0 to 2 here). */
export function placePoint(d: DecimalDigits, point: number): string {
  const whole = point + 1;
  const padded = d.digits.padEnd(whole, "0");
  const frac = padded.slice(whole);
  return `${d.negative ? "-" : ""}${padded.slice(0, whole)}${frac ? `.${frac}` : ""}`;
}

/**
 * Text with any "Infinity", "-Infinity", "NaN" or "undefined" that a template
 * string or String() put there said in words (as formatNumber says them).
 * The last guard of every message: formula notes and error messages pass
 * through it, so no message shows a program's internals even where its
 * numbers were not formatted with formatNumber.
 *
 * @example
 * inWords("flux density Infinity mT"); // "flux density a value beyond the double range mT"
 */
export function inWords(text: string): string {
  return text
    .replace(/-Infinity\b/g, `minus ${BEYOND_RANGE}`)
    .replace(/\bInfinity\b/g, BEYOND_RANGE)
    .replace(/\bNaN\b/g, NOT_A_NUMBER)
    .replace(/\bundefined\b/g, "nothing");
}

/**
 * A ratio as a percentage: formatPercent(0.0123) is "1.2 %". A ratio whose
 * percentage would overflow (above 1.8e306) is written as a plain factor:
 * "10e306 times".
 */
export function formatPercent(ratio: number, significant = 2): string {
  const p = 100 * ratio;
  if (p - p !== 0 && ratio - ratio === 0) return `${formatNumber(ratio, significant)} times`;
  return `${formatNumber(p, significant)} %`;
}

/**
 * A quantity in a scaled unit, `value * scale` followed by `unit` (b = 0.02 T
 * with scale 1e3 and "mT" gives "20 mT"). When the scaled value would not be
 * finite (b near the largest double), it is written in the base unit instead,
 * so a message never shows an overflowed figure.
 *
 * @example
 * formatScaled(0.02, 1e3, "mT", "T"); // "20 mT"
 * formatScaled(1e307, 1e3, "mT", "T"); // "10e306 T"
 */
export function formatScaled(value: number, scale: number, unit: string, baseUnit: string, significant = 2): string {
  const scaled = value * scale;
  const [v, u] = scaled - scaled === 0 || value - value !== 0 ? [scaled, unit] : [value, baseUnit];
  return u ? `${formatNumber(v, significant)} ${u}` : formatNumber(v, significant);
}

// Plain decimal notation of an already-rounded value in [1e-3, 1e6).
function plain(v: number, digits: number): string {
  const mag = Math.abs(v);
  const decimals = Math.max(0, digits - 1 - Math.floor(Math.log10(mag)));
  return v.toFixed(Math.min(20, decimals));
}

function stripZeros(s: string): string {
  return s.includes(".") ? s.replace(/\.?0+$/, "") : s;
}
