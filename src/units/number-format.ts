// Number and prefix formatting for display, written without mathjs so that
// printing a result (CLI help, list, show, formatQuantity) never loads it.
// The rules reproduce mathjs 15's Unit.format and format(number) (checked
// against mathjs in tests/units/number-format.test.ts), so text is unchanged.

/**
 * `v` rounded to `precision` significant digits the way mathjs rounds: on the
 * shortest decimal text of the number, half away from zero. Returns the digits
 * (exactly `precision` of them, zero-padded) and the decimal exponent of the first.
 */
export function roundDigits(v: number, precision: number): { readonly digits: string; readonly exponent: number } {
  const [mant, exp] = Math.abs(v).toExponential().split("e") as [string, string];
  let digits = mant.replace(".", "");
  let exponent = Number(exp);
  if (digits.length > precision) {
    const up = digits.charCodeAt(precision) >= 53; // "5"
    digits = digits.slice(0, precision);
    if (up) {
      // Carry from the right; at most `precision` steps.
      const d = [...digits].map(Number);
      let i = precision - 1;
      while (i >= 0 && d[i] === 9) d[i--] = 0;
      if (i < 0) {
        d.unshift(1);
        d.pop();
        exponent++;
      } else {
        d[i] = d[i]! + 1;
      }
      digits = d.join("");
    }
  }
  return { digits: digits.padEnd(precision, "0"), exponent };
}

/** Digits with a decimal point after `intDigits` of them, trailing fraction zeros dropped. */
function place(digits: string, intDigits: number): string {
  if (intDigits <= 0) return `0.${"0".repeat(-intDigits)}${digits}`.replace(/\.?0+$/, "") || "0";
  const int = digits.slice(0, intDigits).padEnd(intDigits, "0");
  const frac = digits.slice(intDigits).replace(/0+$/, "");
  return frac ? `${int}.${frac}` : int;
}

const sign = (v: number): string => (v < 0 ? "-" : "");
const expText = (e: number): string => `e${e >= 0 ? "+" : "-"}${Math.abs(e)}`;

/**
 * mathjs's "auto" notation: `precision` significant digits, positional for
 * 1e-3 <= |v| < 1e5, exponential otherwise, trailing zeros dropped.
 */
export function formatAuto(v: number, precision: number): string {
  if (v === 0 || !Number.isFinite(v)) return String(v);
  const { digits, exponent } = roundDigits(v, precision);
  if (exponent < -3 || exponent >= 5) return `${sign(v)}${place(digits, 1)}${expText(exponent)}`;
  return `${sign(v)}${place(digits, exponent + 1)}`;
}

/**
 * Engineering notation as mathjs writes it with `precision` significant digits
 * (exponent a multiple of 3, zeros kept): "123.5e+3", "1.000e+0".
 */
export function formatEngineering(v: number, precision: number): string {
  if (v === 0 || !Number.isFinite(v)) return String(v);
  const { digits, exponent } = roundDigits(v, precision);
  const eng = Math.floor(exponent / 3) * 3;
  const intDigits = exponent - eng + 1; // 1, 2 or 3
  const padded = digits.padEnd(intDigits, "0");
  const int = padded.slice(0, intDigits);
  const frac = padded.slice(intDigits);
  return `${sign(v)}${int}${frac ? `.${frac}` : ""}${expText(eng)}`;
}

// The SI prefixes mathjs marks as scientific (powers of 1000), in mathjs's order.
const PREFIXES: readonly (readonly [string, number])[] = [
  ["", 1], ["k", 1e3], ["M", 1e6], ["G", 1e9], ["T", 1e12], ["P", 1e15], ["E", 1e18], ["Z", 1e21], ["Y", 1e24],
  ["R", 1e27], ["Q", 1e30], ["m", 1e-3], ["u", 1e-6], ["n", 1e-9], ["p", 1e-12], ["f", 1e-15], ["a", 1e-18],
  ["z", 1e-21], ["y", 1e-24], ["r", 1e-27], ["q", 1e-30],
];

/**
 * The prefix mathjs's Unit picks for a value of a coherent unit raised to
 * `power` (2 for m^2): the one whose scaled value has a log10 closest to 1.2
 * (so 0.6 m and 500 mm, not 0.5 m), the bare unit when that is within range.
 */
export function bestPrefix(absValue: number, power: number): readonly [string, number] {
  if (absValue === 0) return PREFIXES[0]!;
  const offsetLog = (p: number): number => Math.log(absValue / Math.pow(p, power)) / Math.LN10 - 1.2;
  const own = offsetLog(1);
  if (own > -2.200001 && own < 1.800001) return PREFIXES[0]!;
  let best = PREFIXES[0]!;
  let bestDiff = Math.abs(own);
  for (const p of PREFIXES) {
    const diff = Math.abs(offsetLog(p[1]));
    if (diff < bestDiff) {
      best = p;
      bestDiff = diff;
    }
  }
  return best;
}

/**
 * A value of a simple unit ("F", "m^2") with the best prefix, as mathjs's
 * `unit(v, u).format({ precision })` writes it: "8.854 pF", "100 mm^2".
 */
export function formatPrefixed(v: number, unit: string, precision: number): string {
  const m = /^([A-Za-z]+)(?:\^(\d))?$/.exec(unit);
  const base = m?.[1] ?? unit;
  const power = m?.[2] === undefined ? 1 : Number(m[2]);
  const [name, factor] = bestPrefix(Math.abs(v), power);
  return `${formatAuto(v / Math.pow(factor, power), precision)} ${name}${base}${power === 1 ? "" : `^${power}`}`;
}
