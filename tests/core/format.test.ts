// Message formatting: readable numbers in warnings, never "1.0e+2".
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { evaluate } from "../../src/core/evaluate.js";
import { formatNumber, formatPercent, formatScaled } from "../../src/core/format.js";
import { listFormulas } from "../../src/core/registry.js";
import type { InputSpec } from "../../src/core/spec.js";
import { formatQuantity, formatSI } from "../../src/units/display.js";
import { parseQuantity } from "../../src/units/parse.js";

describe("number formatting for messages", () => {
  it("round numbers print plainly and extremes in engineering notation (exponent a multiple of 3)", () => {
    const cases: [number, string][] = [
      [100, "100"], [99.96, "100"], [999.6, "1000"], [1.5, "1.5"], [2, "2"], [0.012345, "0.012"],
      [0.001, "0.001"], [0.00099996, "0.001"], [123456, "120000"], [999999, "1e6"], [3.4e-7, "340e-9"],
      [-2.5e12, "-2.5e12"], [0, "0"], [1.7976931348623157e308, "180e306"], [5e-324, "4.9e-324"], [1.23e-4, "120e-6"],
    ];
    for (const [v, s] of cases) expect(formatNumber(v), String(v)).toBe(s);
    expect(formatNumber(0.000123456, 3)).toBe("123e-6");
    expect(formatPercent(1)).toBe("100 %");
    expect(formatPercent(0.0123)).toBe("1.2 %");
  });

  it("formatted numbers read back within the requested precision and never show e+", () => {
    fc.assert(
      fc.property(fc.double({ noNaN: true, noDefaultInfinity: true }), fc.integer({ min: 1, max: 6 }), (v, d) => {
        const s = formatNumber(v, d);
        expect(s).not.toMatch(/e\+|\.0*$|\.\d*0$/);
        // Engineering notation: an exponent is a multiple of 3 and the mantissa is 1 to below 1000.
        const exp = /^(-?[\d.]+)e(-?\d+)$/.exec(s);
        if (exp) {
          expect(Math.abs(Number(exp[2])) % 3).toBe(0);
          expect(Math.abs(Number(exp[1]))).toBeGreaterThanOrEqual(1);
          expect(Math.abs(Number(exp[1]))).toBeLessThan(1000);
        }
        const back = Number(s);
        if (v === 0) expect(back).toBe(0);
        else if (Math.abs(v) >= 1e-300 && Math.abs(v) < 1e300) expect(Math.abs(back - v) / Math.abs(v)).toBeLessThanOrEqual(0.5 * 10 ** (1 - d) * 1.0000001);
      }),
    );
  });
});

describe("non-finite values in messages", () => {
  it("never prints Infinity or NaN: words instead", () => {
    expect(formatNumber(Infinity)).toBe("a value beyond the double range");
    expect(formatNumber(-Infinity)).toBe("minus a value beyond the double range");
    expect(formatNumber(NaN)).toBe("not a number");
    expect(formatPercent(Infinity)).not.toMatch(/Infinity|NaN/);
  });

  it("writes a percentage that would overflow as a plain factor", () => {
    expect(formatPercent(1e307)).toBe("10e306 times");
    expect(formatPercent(1e306)).toBe("100e306 %");
  });

  it("formats a scaled quantity in its base unit when the scaled value would overflow", () => {
    expect(formatScaled(0.02, 1e3, "mT", "T")).toBe("20 mT");
    expect(formatScaled(1e307, 1e3, "mT", "T")).toBe("10e306 T");
    expect(formatScaled(0.5, 100, "%", "")).toBe("50 %");
    fc.assert(
      fc.property(fc.double({ noNaN: true, noDefaultInfinity: true }), fc.constantFrom(1e3, 1e6, 1e9), (v, scale) => {
        expect(formatScaled(v, scale, "mT", "T")).not.toMatch(/Infinity|NaN/);
      }),
    );
  });
});

describe("messages of every registry formula at extreme inputs", () => {
  it("never show Infinity, NaN or undefined in a result's notes or an error (reported: wireField said \"Infinity mT\")", () => {
    const extremes = [2.2e-308, 5e-324, 1e-300, 1e300, 1.7e308, -1.7e308];
    const problems: string[] = [];
    for (const f of listFormulas()) {
      const specs = Object.entries(f.definition.inputs as Record<string, InputSpec>);
      const ex: Record<string, unknown> = {};
      for (const [n, s] of specs) ex[n] = s.example ?? s.default;
      for (const [n, s] of specs) {
        if ("choices" in s || s.vector) continue;
        for (const v of extremes) {
          let text: string;
          try {
            text = JSON.stringify(evaluate(f.id, { ...ex, [n]: v }));
          } catch (e) {
            text = (e as Error).message;
          }
          if (/Infinity|NaN|undefined/.test(text)) problems.push(`${f.id} ${n} = ${v}: ${text.slice(0, 160)}`);
        }
      }
    }
    expect(problems).toEqual([]);
  });
});

describe("values with units for people (CLI, notebook, docs)", () => {
  it("puts an SI prefix on the unit where it reads well, engineering notation otherwise", () => {
    // Prefix names and powers: BIPM, SI Brochure, 9th ed. (2019), Table 7; the values are our own.
    const cases: [number, string, string][] = [
      [8.8541878188e-12, "F", "8.854 pF"], [1e-4, "m^2", "100 mm^2"], [5e-9, "m^3", "5 mm^3"], [3.5e-4, "m^3", "350e-6 m^3"],
      [2500, "V/m", "2.5 kV/m"], [3e-6, "kg", "3 mg"], [1500, "kg", "1.5e3 kg"], [-1.602176634e-19, "C", "-160.2 zC"],
      [2e193, "T", "20e192 T"], [999.96, "V", "1 kV"], [3600, "s", "3.6e3 s"], [58e6, "S/m", "58 MS/m"],
      [1e12, "V m/s", "1e12 V m/s"], [1e22, "1/m^3", "10e21 1/m^3"], [0, "m", "0 m"], [4.4, "", "4.4"], [2e-9, "", "2e-9"],
    ];
    for (const [v, unit, text] of cases) expect(formatQuantity(v, unit), `${v} ${unit}`).toBe(text);
  });

  it("writes the shortest digits that read back as the same double when asked", () => {
    expect(formatQuantity(8.8541878188e-12, "F", "shortest")).toBe("8.8541878188 pF");
    expect(formatQuantity(0.1 + 0.2, "m", "shortest")).toBe("300.00000000000004 mm");
    fc.assert(
      fc.property(fc.double({ min: 1e-20, max: 1e20, noNaN: true }), fc.constantFrom("m", "F", "V/m", "m^2", "kg", "V m/s"), (v, unit) => {
        const text = formatQuantity(v, unit, "shortest");
        // Read back through the library's own unit strings (mathjs underneath, correctly rounded by parse-exact).
        expect(parseQuantity(text).si, text).toBe(v);
      }),
      { numRuns: 2000 },
    );
  });

  it("keeps full precision, without e+, in the SI column", () => {
    expect(formatSI(1.2345678901234566e193, "T")).toBe("1.2345678901234566e193 T");
    expect(Number(formatSI(0.1 + 0.2, ""))).toBe(0.1 + 0.2);
  });
});
