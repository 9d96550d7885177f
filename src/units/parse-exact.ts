import { type DecimalFactor, decimalFactor, EXACT_POWERS, scaleDecimal } from "./decimal-scale.js";

/**
 * The units of a parsed string, in mathjs's shape (a mathjs Unit is one; the
 * fast reader of unit-reader.ts builds the same list), so both readers round
 * through this one function.
 */
export interface UnitTerms {
  readonly units: readonly {
    readonly power: number;
    readonly prefix: { readonly value: unknown };
    readonly unit: { readonly value: unknown; readonly offset: unknown };
  }[];
}

// The number a unit string starts with, as the engineer typed it: whole text, sign,
// integer digits, fraction digits (after "5." or ".5"), exponent.
const LEADING_NUMBER = /^\s*(([+-]?)(?:(\d+)\.?(\d*)|\.(\d+))(?:[eE]([+-]?\d+))?)/;

/**
 * The SI value of a parsed unit string, correctly rounded from the decimal the
 * engineer typed: "10 uH" is exactly 1e-5 (mathjs multiplies by the double
 * 1e-6 and gives 9.999999999999999e-6). The factor of each unit in the string
 * (prefix and unit value, raised to its power) is taken as the decimal it is
 * written as; the product of decimals is exact and rounded once by Number().
 *
 * `approx` is mathjs's own SI value. It is returned unchanged where the exact
 * route does not apply: units with an offset (degC), a factor that is not a
 * short decimal (deg = pi/180), a non-decimal factor under a negative power
 * (1/in), a fractional power, or text whose leading number is not what mathjs
 * read (checked to 1e-9).
 */
export function exactSI(text: string, unit: UnitTerms, approx: number): number {
  const m = LEADING_NUMBER.exec(text);
  if (m === null || approx - approx !== 0) return approx;
  let coefficient = 1n;
  let exponent = 0;
  // One entry per unit symbol of the string; a string is at most 200 characters, so a few dozen at most.
  for (const u of unit.units) {
    const { power } = u;
    if (u.unit.offset !== 0 || !Number.isInteger(power) || Math.abs(power) > 64) return approx;
    for (const f of [u.prefix.value, u.unit.value]) {
      if (f === 1) continue;
      // degR's value is mathjs's Fraction 5/9, no decimal: mathjs's own value stands.
      if (typeof f !== "number") return approx;
      const d = factorOf(f);
      if (d === undefined || (power < 0 && d[0] !== 1)) return approx;
      if (power > 0) coefficient *= BigInt(d[0]) ** BigInt(power);
      exponent += d[1] * power;
    }
  }
  const exact = scaleText(m, coefficient, exponent);
  if (exact === undefined || exact - exact !== 0) return approx;
  // Guard against a leading number that is not the value mathjs read (hex, "1e3.5"...).
  return Math.abs(exact - approx) <= 1e-9 * Math.abs(approx) ? exact : approx;
}

/**
 * The number matched by LEADING_NUMBER times coefficient times 10^exponent,
 * correctly rounded. Fast path (W. D. Clinger, "How to read floating point
 * numbers accurately", PLDI 1990): when the digits times the coefficient are a
 * whole number below 2^53 and the power of ten is exact (|e| <= 22), one
 * multiplication or division rounds once. Otherwise scaleDecimal's exact
 * product. Here, not in scaleDecimal, so the typed path's bundle stays as it is.
 */
function scaleText(m: RegExpExecArray, coefficient: bigint, exponent: number): number | undefined {
  const frac = m[4] || m[5] || "";
  const digits = (m[3] ?? "") + frac;
  const e = (m[6] === undefined ? 0 : Number(m[6])) - frac.length + exponent;
  const c = Number(coefficient);
  if (digits.length <= 15 && e >= -22 && e <= 22 && c < 9007199254740992) {
    const whole = Number(digits) * c;
    if (whole < 9007199254740992) {
      const v = e >= 0 ? whole * EXACT_POWERS[e]! : whole / EXACT_POWERS[-e]!;
      return m[2] === "-" ? -v : v;
    }
  }
  return scaleDecimal(m[1]!, coefficient, exponent);
}

// Decimal factors of the prefix and unit values met so far: a finite set (the
// values of the instance's units and prefixes), each worked out once.
const factors = new Map<number, DecimalFactor | undefined>();

function factorOf(f: number): DecimalFactor | undefined {
  if (factors.has(f)) return factors.get(f);
  const d = decimalFactor(f);
  factors.set(f, d);
  return d;
}
