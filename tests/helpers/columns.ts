import { expect } from "vitest";
import type { ColumnsResult } from "../../src/tools/columns.js";

const bytes = (a: Float64Array | Uint8Array): Buffer => Buffer.from(a.buffer, a.byteOffset, a.byteLength);

/** Two columns results are the same bit for bit: arrays by their bytes (NaN and -0 included), the rest by strict equality. */
export function expectSameColumns(r: ColumnsResult, one: ColumnsResult, label: string): void {
  expect(Buffer.compare(bytes(r.output.values), bytes(one.output.values)), `${label}: values`).toBe(0);
  for (const [k, c] of Object.entries(one.output.components ?? {})) expect(Buffer.compare(bytes(r.output.components![k]!), bytes(c)), `${label}: ${k}`).toBe(0);
  expect(Buffer.compare(bytes(r.errors), bytes(one.errors)), `${label}: errors`).toBe(0);
  const rest = (x: ColumnsResult): unknown => ({ ...x, output: { ...x.output, values: undefined, components: undefined }, errors: undefined });
  expect(rest(r), label).toStrictEqual(rest(one));
}
