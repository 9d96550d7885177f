import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { add, div, mul, neg, sqrt, sub } from "../../src/units/arithmetic.js";
import { inUnit, quantity } from "../../src/units/quantity.js";
import type { Area, Capacitance, Current, Length, Time, Voltage } from "../../src/units/types.js";

// Typed arithmetic must be the plain operation at run time: the dimension
// bookkeeping lives only in the types. Oracle: JavaScript's own operators.
const finite = fc.double({ min: -1e150, max: 1e150, noNaN: true });
const positive = fc.double({ min: 1e-150, max: 1e150, noNaN: true });
const len = (v: number) => v as Length;

describe("typed arithmetic at run time", () => {
  it("add and sub are + and -", () => {
    fc.assert(fc.property(finite, finite, (a, b) => add(len(a), len(b)) === a + b && sub(len(a), len(b)) === a - b));
  });

  it("mul and div are * and /", () => {
    fc.assert(fc.property(finite, positive, (a, b) => mul(len(a), len(b)) === a * b && div(len(a), len(b)) === a / b));
  });

  it("sqrt of an area is Math.sqrt, and squaring it back returns the area to an ulp", () => {
    fc.assert(
      fc.property(positive, (a) => {
        const r = sqrt(a as Area);
        return r === Math.sqrt(a) && Math.abs(mul(r, r) - a) <= 2 * Number.EPSILON * a;
      }),
    );
  });

  it("neg is unary minus", () => {
    fc.assert(fc.property(finite, (a) => Object.is(neg(len(a)), -a)));
  });

  it("a + b - b returns a when no rounding is involved (integers)", () => {
    fc.assert(fc.property(fc.integer(), fc.integer(), (a, b) => sub(add(len(a), len(b)), len(b)) === a));
  });

  it("Q = C V and I t = Q agree in unit terms: 4.7 uF at 10 V holds 47 uC", () => {
    // Worked by hand: 4.7e-6 F * 10 V = 4.7e-5 C.
    const c: Capacitance = quantity(4.7, "uF");
    const v: Voltage = quantity(10, "V");
    const charge = mul(c, v);
    expect(inUnit(charge, "uC")).toBeCloseTo(47, 12);
    const i: Current = quantity(47, "mA");
    const t: Time = quantity(1, "ms");
    expect(mul(i, t)).toBeCloseTo(charge, 18);
  });
});
