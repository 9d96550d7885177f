import type Decimal from "decimal.js";

const view = new DataView(new ArrayBuffer(8));

/**
 * The exact value of a finite double in the oracle's Decimal constructor: its
 * full binary expansion m 2^e written as the decimal m 5^k / 10^k (e = -k < 0),
 * so no digit is rounded on the way in (decimal.js keeps constructed digits).
 * The oracles of several families share it.
 */
export function exactDecimal<C extends typeof Decimal>(x: number, Ctor: C): Decimal {
  if (!Number.isFinite(x)) throw new Error(`not finite: ${x}`);
  if (x === 0) return new Ctor(0);
  view.setFloat64(0, x);
  const b = view.getBigUint64(0);
  const expBits = Number((b >> 52n) & 0x7ffn);
  const frac = b & ((1n << 52n) - 1n);
  const m = expBits === 0 ? frac : frac | (1n << 52n);
  const e = (expBits === 0 ? 1 : expBits) - 1075; // x = m * 2^e
  const s = e >= 0 ? (m << BigInt(e)).toString() : `${m * 5n ** BigInt(-e)}e-${-e}`;
  return new Ctor(b >> 63n === 1n ? `-${s}` : s);
}
