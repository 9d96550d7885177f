// Message formatting: readable numbers in warnings, never "1.0e+2".
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { evaluate } from "../../src/core/evaluate.js";
import { formatNumber, formatPercent, formatScaled } from "../../src/core/format.js";
import { listFormulas } from "../../src/core/registry.js";
import type { InputSpec } from "../../src/core/spec.js";

describe("number formatting for messages", () => {
  it("round numbers print plainly and extremes in short exponent form", () => {
    const cases: [number, string][] = [
      [100, "100"], [99.96, "100"], [999.6, "1000"], [1.5, "1.5"], [2, "2"], [0.012345, "0.012"],
      [0.001, "0.001"], [0.00099996, "0.001"], [123456, "120000"], [999999, "1e6"], [3.4e-7, "3.4e-7"],
      [-2.5e12, "-2.5e12"], [0, "0"], [1.7976931348623157e308, "1.8e308"], [5e-324, "4.9e-324"],
    ];
    for (const [v, s] of cases) expect(formatNumber(v), String(v)).toBe(s);
    expect(formatNumber(0.000123456, 3)).toBe("1.23e-4");
    expect(formatPercent(1)).toBe("100 %");
    expect(formatPercent(0.0123)).toBe("1.2 %");
  });

  it("formatted numbers read back within the requested precision and never show e+", () => {
    fc.assert(
      fc.property(fc.double({ noNaN: true, noDefaultInfinity: true }), fc.integer({ min: 1, max: 6 }), (v, d) => {
        const s = formatNumber(v, d);
        expect(s).not.toMatch(/e\+|\.0*$|\.\d*0$/);
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
    expect(formatPercent(1e307)).toBe("1e307 times");
    expect(formatPercent(1e306)).toBe("1e308 %");
  });

  it("formats a scaled quantity in its base unit when the scaled value would overflow", () => {
    expect(formatScaled(0.02, 1e3, "mT", "T")).toBe("20 mT");
    expect(formatScaled(1e307, 1e3, "mT", "T")).toBe("1e307 T");
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
