/**
 * Number formatting for warning and caution messages: short, readable, never
 * the "1.0e+2" that `toPrecision` gives for round numbers.
 */

/**
 * A number with `significant` digits (default 2): plain notation between
 * 0.001 and 1e6 ("100", "2.5", "0.012"), exponent notation outside ("3.4e-7",
 * "1.2e9"). Trailing zeros after the point are dropped.
 *
 * @example
 * formatNumber(100); // "100"
 * formatNumber(0.000123456, 3); // "1.23e-4"
 */
export function formatNumber(v: number, significant = 2): string {
  if (!Number.isFinite(v)) return String(v);
  if (v === 0) return "0";
  const digits = Math.min(21, Math.max(1, Math.round(significant)));
  // Round first: rounding may carry into the next decade (999.6 -> "1.0e+3"),
  // and the rounded value decides the notation. Number() reads either form.
  const rounded = Number(v.toPrecision(digits));
  const mag = Math.abs(rounded);
  if (mag >= 1e-3 && mag < 1e6) return stripZeros(plain(rounded, digits));
  // Near the largest double the rounded value can overflow: use v itself.
  const [m, e] = (Number.isFinite(rounded) ? rounded : v).toExponential(digits - 1).split("e");
  return `${stripZeros(m!)}e${Number(e)}`;
}

/** A ratio as a percentage: formatPercent(0.0123) is "1.2 %". */
export function formatPercent(ratio: number, significant = 2): string {
  return `${formatNumber(100 * ratio, significant)} %`;
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
