import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { FormulaError, biotSavart, boxMesh, checkClosedSurface, closedSurfaceFlux, sphereMesh, type TriangleMesh } from "../../src/index.js";
import { DUNAVANT_5 } from "../../src/flux/surface-flux.js";
import { relativeError } from "../helpers/reference.js";
import { EPS0 } from "./oracle.js";

const EPS0_NUM = EPS0.toNumber();

/** Field of point charges (q, x, y, z) in vacuum. */
function chargesField(charges: readonly (readonly [number, number, number, number])[]) {
  return (x: number, y: number, z: number, out: Float64Array): void => {
    out[0] = 0;
    out[1] = 0;
    out[2] = 0;
    for (const [q, cx, cy, cz] of charges) {
      const dx = x - cx, dy = y - cy, dz = z - cz;
      const r = Math.hypot(dx, dy, dz);
      const k = q / (4 * Math.PI * EPS0_NUM * r * r * r);
      out[0] += k * dx;
      out[1] += k * dy;
      out[2] += k * dz;
    }
  };
}

describe("Dunavant's degree-5 rule", () => {
  it("integrates every monomial x^a y^b of degree <= 5 exactly over the reference triangle", () => {
    // Exact: integral over {x, y >= 0, x + y <= 1} of x^a y^b = a! b! / (a + b + 2)! (e.g. Dunavant 1985, eq. (4)).
    const fact = (n: number): number => (n <= 1 ? 1 : n * fact(n - 1));
    for (let a = 0; a <= 5; a++) {
      for (let b = 0; a + b <= 5; b++) {
        let s = 0;
        for (const [, l1, l2, w] of DUNAVANT_5) s += w * l1 ** a * l2 ** b;
        const exact = (fact(a) * fact(b)) / fact(a + b + 2);
        expect(relativeError(s / 2, exact), `x^${a} y^${b}`).toBeLessThan(1e-14); // area 1/2
      }
    }
  });
});

describe("mesh builders", () => {
  it("make closed, outward surfaces whose volumes approach the solid's", () => {
    expect(relativeError(checkClosedSurface(boxMesh([0, 0, 0], [1, 2, 3], [2, 3, 4])), 6)).toBeLessThan(1e-14);
    const v5 = checkClosedSurface(sphereMesh([1, 2, 3], 2, 5));
    expect(relativeError(v5, (4 / 3) * Math.PI * 8)).toBeLessThan(2e-3); // inscribed facets, 20480 triangles
    expect(sphereMesh([0, 0, 0], 1, 2).triangles.length / 3).toBe(320);
    expect(boxMesh([0, 0, 0], [1, 1, 1], 2).triangles.length / 3).toBe(48);
  });
});

describe("closedSurfaceFlux", () => {
  it("gives Q_enclosed / eps0 for random point charges inside and outside a sphere (Gauss's law, fast-check)", () => {
    const mesh = sphereMesh([0, 0, 0], 1, 4);
    const charge = fc.tuple(
      // Charges not vanishingly small: a zero (or subnormal) charge has no field to integrate.
      fc.double({ min: -1e-9, max: 1e-9, noNaN: true }).filter((q) => Math.abs(q) > 1e-15),
      fc.double({ min: -1, max: 1, noNaN: true }),
      fc.double({ min: -1, max: 1, noNaN: true }),
      fc.double({ min: -1, max: 1, noNaN: true }),
    );
    fc.assert(
      fc.property(fc.array(charge, { minLength: 1, maxLength: 4 }), fc.boolean(), (raw, outside) => {
        // Charges at radius <= 0.5 inside, or >= 2 outside: the quadrature error is then below 1e-6 of the flux.
        const charges = raw.map(([q, x, y, z]) => {
          const r = Math.hypot(x, y, z) || 1;
          const target = outside ? 2 + r : 0.5 * r;
          return [q, (x / r) * target, (y / r) * target, (z / r) * target] as const;
        });
        const enclosed = outside ? 0 : charges.reduce((s, c) => s + c[0], 0);
        const { flux, absoluteFlux } = closedSurfaceFlux(mesh, chargesField(charges));
        const scale = charges.reduce((s, c) => s + Math.abs(c[0]), 0) / EPS0_NUM;
        expect(Math.abs(flux - enclosed / EPS0_NUM)).toBeLessThan(1e-6 * scale);
        expect(absoluteFlux).toBeGreaterThan(0);
      }),
      { numRuns: 30 },
    );
  });

  it("gives Q / eps0 through a box around an off-centre charge, and through the same box turned inside out", () => {
    const box = boxMesh([-1, -1, -1], [1, 2, 1], 12);
    const field = chargesField([[1e-9, 0.2, 0.4, -0.1]]);
    const { flux } = closedSurfaceFlux(box, field);
    expect(relativeError(flux, 1e-9 / EPS0_NUM)).toBeLessThan(1e-6);
    const flipped = new Uint32Array(box.triangles);
    for (let t = 0; t < flipped.length; t += 3) [flipped[t + 1], flipped[t + 2]] = [flipped[t + 2]!, flipped[t + 1]!];
    expect(relativeError(closedSurfaceFlux({ vertices: box.vertices, triangles: flipped }, field).flux, flux)).toBeLessThan(1e-12);
  });

  it("gives zero magnetic flux for a polygon loop's field (Gauss's law for magnetism)", () => {
    const n = 32;
    const path = new Float64Array(3 * (n + 1));
    for (let i = 0; i <= n; i++) {
      const t = (2 * Math.PI * i) / n;
      path.set([0.3 * Math.cos(t), 0.3 * Math.sin(t), 0.1], 3 * i);
    }
    const p = new Float64Array(3);
    const b = new Float64Array(3);
    const field = (x: number, y: number, z: number) => {
      p[0] = x; p[1] = y; p[2] = z;
      return biotSavart(path, 5, p, b);
    };
    // A sphere that the loop pierces would contain a singular line; use one that encloses part of the field region only.
    const { flux, absoluteFlux } = closedSurfaceFlux(sphereMesh([0.2, 0, 0.6], 0.4, 3), field);
    expect(Math.abs(flux)).toBeLessThan(1e-7 * absoluteFlux);
  });

  it("gives zero flux for a dipole field through surfaces that enclose the dipole (fast-check)", () => {
    // Point dipole m along z: B = mu0/(4 pi) (3 (m.r) r / r^5 - m / r^3); its flux through any closed surface is 0.
    const dipole = (x: number, y: number, z: number): [number, number, number] => {
      const r2 = x * x + y * y + z * z, r = Math.sqrt(r2), r5 = r2 * r2 * r;
      return [(3 * z * x) / r5, (3 * z * y) / r5, (3 * z * z) / r5 - 1 / (r2 * r)];
    };
    const mesh = sphereMesh([0, 0, 0], 1, 3);
    fc.assert(
      fc.property(fc.double({ min: -0.3, max: 0.3, noNaN: true }), fc.double({ min: -0.3, max: 0.3, noNaN: true }), (sx, sz) => {
        const shifted = new Float64Array(mesh.vertices);
        for (let i = 0; i < shifted.length; i += 3) { shifted[i]! += sx; shifted[i + 2]! += sz; }
        const { flux, absoluteFlux } = closedSurfaceFlux({ vertices: shifted, triangles: mesh.triangles }, dipole);
        expect(Math.abs(flux)).toBeLessThan(1e-4 * absoluteFlux);
      }),
      { numRuns: 20 },
    );
  });

  it("rejects open or inconsistently oriented meshes with invalid_argument", () => {
    const box = boxMesh([0, 0, 0], [1, 1, 1], 1);
    const code = (mesh: TriangleMesh) => {
      try {
        closedSurfaceFlux(mesh, () => [0, 0, 1]);
      } catch (e) {
        expect(e).toBeInstanceOf(FormulaError);
        return (e as FormulaError).code + ":" + (e as FormulaError).message;
      }
      return "no error";
    };
    expect(code({ vertices: box.vertices, triangles: box.triangles.slice(3) })).toMatch(/invalid_argument:.*not closed/);
    const flipped = new Uint32Array(box.triangles);
    [flipped[1], flipped[2]] = [flipped[2]!, flipped[1]!];
    expect(code({ vertices: box.vertices, triangles: flipped })).toMatch(/invalid_argument:.*orient/);
    expect(code({ vertices: box.vertices, triangles: new Uint32Array([0, 1, 99, ...box.triangles.slice(3)]) })).toMatch(/invalid_argument/);
    expect(() => sphereMesh([0, 0, 0], -1, 2)).toThrow(FormulaError);
    expect(() => boxMesh([0, 0, 0], [0, 1, 1], 2)).toThrow(FormulaError);
  });
});
