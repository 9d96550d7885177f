// Every windings formula against a decimal.js oracle of its published expression, over
// inputs log-spread across the double range. Closed forms: within a few ulp of the exact
// value of the double inputs, or out_of_range where that value is not a double. The round
// wire AC factor: within 1e-14 relative of the Bessel-function ratio (oracle.ts: Kelvin
// series DLMF 10.65.3 and Hankel's expansion DLMF 10.17.3, at 90 digits) for every
// a / delta from 0 to 1e308; the brief for it asks 1e-12.
import fc from "fast-check";
import { afterAll, describe, expect, it } from "vitest";
import { roundWireAcResistanceFactor, wireGaugeDiameter, wireResistance } from "../../src/index.js";
import { roundWireResistanceRatio, SERIES_LIMIT } from "../../src/windings/kelvin.js";
import { WIRE_GAUGES } from "../../src/windings/wire.js";
import { agreesWithOracle } from "../capacitance/oracle.js";
import { acRatio, D, type Dec, exact, hankelRatio, kelvinRatio, MU0, PI } from "./oracle.js";

const EPS = Number.EPSILON;
const worst = new Map<string, number>();
afterAll(() => console.log([...worst].map(([k, v]) => `${k}: ${(v / EPS).toFixed(2)} eps (${v.toExponential(2)})`).join("\n")));
const note = (id: string, err: number) => worst.set(id, Math.max(worst.get(id) ?? 0, err));
const relErr = (got: number, want: Dec) => exact(got).minus(want).div(want).abs().toNumber();
const decades = (lo: number, hi: number) => fc.double({ min: lo, max: hi, noNaN: true }).map((p) => 10 ** p);

describe("windings formulas against a decimal.js oracle across the double range", () => {
  it("wireGaugeDiameter is within 4 ulp of 0.127 mm * 92^((36 - n)/39) for every gauge (ASTM B258)", () => {
    for (const g of WIRE_GAUGES) {
      const n = g.endsWith("/0") ? 1 - Number(g[0]) : Number(g);
      const want = new D("0.000127").times(new D(92).pow(new D(36 - n).div(39)));
      const err = relErr(wireGaugeDiameter({ gauge: g }), want);
      note("wireGaugeDiameter", err);
      expect(err, `AWG ${g}`).toBeLessThanOrEqual(4 * EPS);
    }
  });

  it("wireResistance is within 6 ulp of rho20 (1 + alpha20 (T - 293.15)) l / (pi d^2 / 4) (IEC 60028, IEC 60889)", () => {
    fc.assert(
      fc.property(decades(-300, 300), decades(-300, 300), fc.double({ min: 50, max: 2000, noNaN: true }), fc.constantFrom("copper" as const, "aluminium" as const), (length, diameter, temperature, material) => {
        const rho = material === "copper" ? new D(1).div("58e6") : new D("0.028264e-6");
        const alpha = new D(material === "copper" ? "0.00393" : "0.00403");
        const want = rho.times(new D(1).plus(alpha.times(exact(temperature).minus("293.15")))).times(exact(length)).div(PI.times(exact(diameter).pow(2)).div(4));
        agreesWithOracle(wireResistance, { length, diameter, temperature, material }, want, 6 * EPS, worst);
      }),
      { numRuns: 400 },
    );
  });

  it("the oracle's two methods, Kelvin series and Hankel's expansion, agree to 30 digits where both apply", () => {
    for (const x of [25, 31.7, 40]) {
      const k = kelvinRatio(x), h = hankelRatio(x);
      expect(k.minus(h).div(k).abs().toNumber(), `a/delta = ${x}`).toBeLessThan(1e-30);
    }
  });

  it("the oracle's Kelvin functions reproduce the ratio's low-order series 1 + q^4/192 - q^8/92160 ... at q = 0.01 (to 1e-30)", () => {
    // (z/2) J0(z)/J1(z) = 1 - z^2/8 - z^4/192 - z^6/3072 - ...; with z^2 = -j q^2 the real part is
    // 1 + q^4/192 - ... (DLMF 10.2.2 series divided out). Only the q^4 term matters at q = 0.01.
    const q = new D("0.01");
    const want = new D(1).plus(q.pow(4).div(192));
    expect(kelvinRatio(q.div(new D(2).sqrt())).minus(want).abs().toNumber()).toBeLessThan(1e-17);
  });

  it(`the AC factor's ratio is within 1e-14 of the Bessel-function ratio from a/delta = 0 to 1e6, densely around the crossover at ${SERIES_LIMIT}`, () => {
    expect(roundWireResistanceRatio(0)).toBe(1);
    const xs: number[] = [1e-300, 1e-150, 1e-80, 1e-10, 1e-4, 0.01];
    for (let e = -2; e <= 6; e += 0.05) xs.push(10 ** e);
    for (let x = SERIES_LIMIT - 2; x <= SERIES_LIMIT + 2; x += 0.0625) xs.push(x);
    xs.push(SERIES_LIMIT, SERIES_LIMIT * (1 + EPS), SERIES_LIMIT * (1 - EPS / 2));
    for (const x of xs) {
      const got = roundWireResistanceRatio(x);
      const err = relErr(got, acRatio(exact(x)));
      note("roundWireResistanceRatio", err);
      expect(err, `a/delta = ${x}: got ${got}`).toBeLessThanOrEqual(1e-14);
    }
  });

  it("roundWireAcResistanceFactor is within 1e-14 of the ratio at the exact a/delta of its inputs, over 1e-300..1e300", () => {
    fc.assert(
      fc.property(decades(-300, 300), decades(-300, 300), decades(-300, 300), fc.oneof(fc.constant(1), decades(-3, 5)), (diameter, frequency, conductivity, relativePermeability) => {
        const x = exact(diameter).div(2).times(PI.times(exact(frequency)).times(MU0).times(exact(relativePermeability)).times(exact(conductivity)).sqrt());
        const inputs = { diameter, frequency, conductivity, relativePermeability } as unknown as Parameters<typeof roundWireAcResistanceFactor>[0];
        if (x.gt("1e307")) {
          // Near or beyond the largest double the factor (about x/2) may still fit; only finiteness or out_of_range.
          try {
            expect(Number.isFinite(roundWireAcResistanceFactor(inputs))).toBe(true);
          } catch (e) {
            expect((e as { code: string }).code).toBe("out_of_range");
          }
          return;
        }
        const want = acRatio(x);
        const err = relErr(roundWireAcResistanceFactor(inputs), want);
        note("roundWireAcResistanceFactor", err);
        expect(err, JSON.stringify(inputs)).toBeLessThanOrEqual(1e-14);
      }),
      { numRuns: 300 },
    );
  });
});
