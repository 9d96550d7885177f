/**
 * Correctly rounded unit conversion for decimal inputs.
 *
 * A prefix factor such as 1e-6 is not a double: `10 * 1e-6` is
 * 1.0000000000000002e-5 where the engineer meant 10 uH = 1e-5 H exactly. The
 * value the engineer typed is a decimal (the shortest decimal that reads back
 * as the double, or the text of a unit string), and a unit factor of the trade
 * is a decimal too (1e-6, 2.54e-5 for the mil, 1.602176634e-19 for the eV). So
 * the SI value is the exact product of two decimals, digits times digits and a
 * power of ten, handed to `Number()`, whose decimal-to-double conversion is
 * correctly rounded (ECMA-262, Number::toString / StringToNumber).
 */

/** A decimal factor: coefficient (a whole number below 2^53) times 10^exponent. */
export type DecimalFactor = readonly [coefficient: number, exponent: number];

const DECIMAL = /^([+-]?)(\d*)(?:\.(\d*))?(?:[eE]([+-]?\d+))?$/;

/**
 * The shortest decimal of `x` as a coefficient and a power of ten, when it has
 * at most 15 significant digits (a factor written as a decimal: 2.54e-5 gives
 * [254, -7]); undefined for a factor that is not one (pi/180 needs 17 digits).
 */
export function decimalFactor(x: number): DecimalFactor | undefined {
  if (!(x > 0) || x === Infinity) return undefined;
  const m = DECIMAL.exec(x.toExponential())!;
  const digits = m[2]! + (m[3] ?? "");
  if (digits.length > 15) return undefined;
  return [Number(digits), Number(m[4]) - (m[3]?.length ?? 0)];
}

/**
 * The decimal `text` times coefficient times 10^exponent, correctly rounded to
 * a double; undefined when `text` is not a plain decimal number.
 *
 * @example
 * scaleDecimal("10", 1, -6); // 1e-5 (exactly the double nearest 10e-6)
 */
export function scaleDecimal(text: string, coefficient: number | bigint, exponent: number): number | undefined {
  const m = DECIMAL.exec(text);
  if (m === null) return undefined;
  const frac = m[3] ?? "";
  const digits = m[2]! + frac;
  if (digits === "") return undefined;
  const e = (m[4] === undefined ? 0 : Number(m[4])) - frac.length + exponent;
  // A string of digits: BigInt keeps the product exact; Number() rounds once.
  return Number(`${m[1]}${BigInt(digits) * BigInt(coefficient)}e${e}`);
}

// Powers of ten that are doubles exactly (10^22 is the last), read from their
// decimal text (exact) rather than computed with ** (Math.pow need not be
// correctly rounded) and rather than written out (23 literals in every bundle).
export const EXACT_POWERS = /* @__PURE__ */ Array.from({ length: 23 }, (_, k) => Number(`1e${k}`));

/**
 * `value` (read as its shortest decimal) times the decimal factor, correctly
 * rounded. Whole numbers take a fast path: value * coefficient is exact below
 * 2^53 and 10^k is exact for k <= 22, so one multiplication or division rounds
 * once, which is correct rounding. Other values go through their decimal text.
 */
export function scaleNumber(value: number, [coefficient, exponent]: DecimalFactor): number {
  const whole = value * coefficient;
  if (Number.isInteger(value) && Math.abs(whole) <= 9007199254740992 && exponent >= -22 && exponent <= 22) {
    return exponent >= 0 ? whole * EXACT_POWERS[exponent]! : whole / EXACT_POWERS[-exponent]!;
  }
  if (value - value !== 0) return value * coefficient; // NaN and infinities pass through as they are
  return scaleDecimal(value.toExponential(), coefficient, exponent)!;
}

/**
 * `q` expressed in a unit of decimal factor 10^exponent (coefficient 1), one
 * rounding: q * 10^-exponent or q / 10^exponent with an exact power of ten.
 * Undefined where that does not apply (the caller divides by the factor).
 */
export function unscalePower(q: number, [coefficient, exponent]: DecimalFactor): number | undefined {
  if (coefficient !== 1 || exponent < -22 || exponent > 22) return undefined;
  return exponent <= 0 ? q * EXACT_POWERS[-exponent]! : q / EXACT_POWERS[exponent]!;
}
