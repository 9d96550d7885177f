import { describe, expect, it } from "vitest";
import { typedArrayEquality } from "./typed-array-equality.js";

// The fast comparison of typed arrays (registered in tests/setup.ts) gives
// vitest's own answers: the reference here is vitest's comparison with the
// tester out of the way (Array.from turns each side into a plain array of the
// same elements, which vitest compares itself), plus the constructor check.
describe("typed arrays compared in one loop", () => {
  const cases: [string, ArrayBufferView, ArrayBufferView][] = [
    ["equal", Float64Array.of(1, 2, 3), Float64Array.of(1, 2, 3)],
    ["NaN and NaN", Float64Array.of(Number.NaN), Float64Array.of(0 / 0)],
    ["0 and -0", Float64Array.of(0), Float64Array.of(-0)],
    ["one element differs", Float64Array.of(1, 2, 3), Float64Array.of(1, 2, 4)],
    ["lengths differ", Float64Array.of(1, 2), Float64Array.of(1, 2, 0)],
    ["empty", new Float64Array(0), new Float64Array(0)],
    ["bigints", BigInt64Array.of(1n, -2n), BigInt64Array.of(1n, -2n)],
    ["bigints differ", BigInt64Array.of(1n), BigInt64Array.of(2n)],
    ["a view and a copy", new Float64Array([5, 6, 7, 8]).subarray(1, 3), Float64Array.of(6, 7)],
  ];
  it.each(cases)("%s: the same answer as element-wise comparison", (_, a, b) => {
    const reference = Object.is(a.constructor, b.constructor) && expectEqualPlain(a, b);
    expect(typedArrayEquality(a, b)).toBe(reference);
    if (reference) expect(a).toStrictEqual(b);
    else expect(a).not.toStrictEqual(b);
  });

  it("tells kinds apart, as vitest does", () => {
    expect(typedArrayEquality(Float64Array.of(1), Float32Array.of(1))).toBe(false);
    expect(Float64Array.of(1)).not.toEqual(Float32Array.of(1));
  });

  it("leaves to vitest what holds more than its elements, Buffers, DataViews and other values", () => {
    const extra = Object.assign(Float64Array.of(1), { warnings: ["w"] });
    expect(typedArrayEquality(extra, Float64Array.of(1))).toBeUndefined();
    expect(extra).not.toStrictEqual(Float64Array.of(1));
    expect(extra).toStrictEqual(Object.assign(Float64Array.of(1), { warnings: ["w"] }));
    expect(extra).not.toStrictEqual(Object.assign(Float64Array.of(1), { warnings: ["v"] }));
    expect(typedArrayEquality(Buffer.from([1]), Buffer.from([1]))).toBeUndefined();
    expect(typedArrayEquality(new DataView(new ArrayBuffer(1)), new DataView(new ArrayBuffer(1)))).toBeUndefined();
    expect(typedArrayEquality([1], [1])).toBeUndefined();
    expect(typedArrayEquality(1, 1)).toBeUndefined();
  });

  it("nested in results, as a result's columns are", () => {
    expect({ values: Float64Array.of(1, Number.NaN) }).toStrictEqual({ values: Float64Array.of(1, Number.NaN) });
    expect({ values: Float64Array.of(1, -0) }).not.toStrictEqual({ values: Float64Array.of(1, 0) });
  });
});

/** vitest's comparison of the elements as plain arrays. */
function expectEqualPlain(a: ArrayBufferView, b: ArrayBufferView): boolean {
  try {
    expect(Array.from(a as Float64Array)).toStrictEqual(Array.from(b as Float64Array));
    return true;
  } catch {
    return false;
  }
}
