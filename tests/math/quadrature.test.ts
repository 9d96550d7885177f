import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { gaussLegendre, integrate, NEWTON_CAP } from "../../src/math/quadrature.js";
import { expectClose } from "../helpers/reference.js";

describe("Gauss-Legendre quadrature", () => {
  it("the 5-point rule has the tabulated nodes and weights", () => {
    // A&S (1964) Table 25.4, n = 5; closed forms from memory:
    // nodes 0, +-sqrt(5 - 2 sqrt(10/7))/3, +-sqrt(5 + 2 sqrt(10/7))/3;
    // weights 128/225, (322 + 13 sqrt 70)/900, (322 - 13 sqrt 70)/900.
    const { nodes, weights } = gaussLegendre(5);
    const src = "A&S Table 25.4 (closed forms), from memory";
    const x1 = Math.sqrt(5 - 2 * Math.sqrt(10 / 7)) / 3;
    const x2 = Math.sqrt(5 + 2 * Math.sqrt(10 / 7)) / 3;
    expect(nodes[2]).toBe(0);
    expectClose(nodes[3]!, { expected: x1, tolerance: 4e-16, source: src });
    expectClose(nodes[4]!, { expected: x2, tolerance: 4e-16, source: src });
    expectClose(weights[2]!, { expected: 128 / 225, tolerance: 4e-16, source: src });
    expectClose(weights[3]!, { expected: (322 + 13 * Math.sqrt(70)) / 900, tolerance: 4e-16, source: src });
    expectClose(weights[4]!, { expected: (322 - 13 * Math.sqrt(70)) / 900, tolerance: 4e-16, source: src });
  });

  it("is exact for polynomials up to degree 2n - 1", () => {
    // The integral of x^k over [-1, 1] is 2/(k+1) for even k and 0 for odd k.
    for (const n of [1, 2, 3, 4, 7, 12, 20, 40]) {
      for (let k = 0; k <= 2 * n - 1; k++) {
        const got = integrate((x) => Math.pow(x, k), -1, 1, n);
        const exact = k % 2 === 0 ? 2 / (k + 1) : 0;
        expect(Math.abs(got - exact)).toBeLessThan(1e-14);
      }
      // and not exact at degree 2n (the error is tiny but clearly non-zero for small n)
      if (n <= 12) {
        const got = integrate((x) => Math.pow(x, 2 * n), -1, 1, n);
        expect(Math.abs(got - 2 / (2 * n + 1))).toBeGreaterThan(1e-10);
      }
    }
  });

  it("weights sum to 2 and nodes are symmetric and increasing", () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 300 }), (n) => {
        const { nodes, weights } = gaussLegendre(n);
        let s = 0;
        for (let i = 0; i < n; i++) {
          s += weights[i]!;
          expect(nodes[i]! + nodes[n - 1 - i]!).toBe(0);
          if (i > 0) expect(nodes[i]!).toBeGreaterThan(nodes[i - 1]!);
          expect(weights[i]!).toBeGreaterThan(0);
        }
        expect(Math.abs(s - 2)).toBeLessThan(2e-14);
      }),
      { numRuns: 60 },
    );
  });

  it("integrates known functions", () => {
    // Elementary integrals: int_0^1 e^x = e - 1; int_0^pi sin = 2; int_0^1 1/(1+x^2) = pi/4.
    expectClose(integrate(Math.exp, 0, 1, 10), { expected: Math.E - 1, tolerance: 1e-15, source: "calculus" });
    expectClose(integrate(Math.sin, 0, Math.PI, 16), { expected: 2, tolerance: 1e-15, source: "calculus" });
    expectClose(integrate((x) => 1 / (1 + x * x), 0, 1, 20), { expected: Math.PI / 4, tolerance: 1e-15, source: "calculus" });
  });

  it("rejects an unusable order", () => {
    expect(() => gaussLegendre(0)).toThrow(RangeError);
    expect(() => gaussLegendre(2.5)).toThrow(RangeError);
  });

  it("places every node within 6 Newton steps, as its comment states (cap 10)", () => {
    // Measured once over all orders 1..4096 (at most 6); re-measured here on 1..300 and a few large orders.
    let most = 0;
    for (let n = 1; n <= 300; n++) most = Math.max(most, gaussLegendre(n).maxNewtonSteps);
    for (const n of [512, 1000, 2048, 4096]) most = Math.max(most, gaussLegendre(n).maxNewtonSteps);
    expect(most).toBeLessThanOrEqual(6);
    expect(most).toBeGreaterThanOrEqual(3);
    expect(NEWTON_CAP).toBe(10);
  });
});
