// Microstrip: published values (labelled), physical properties, and the
// run-time face (evaluate, warnings, bad input).
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  evaluate, microstripEffectivePermittivity, microstripImpedance, quantity,
  type Frequency, type Length,
} from "../../src/index.js";
import { constant } from "../../src/constants/index.js";
import { expectFormulaError } from "../helpers/errors.js";
import { checkCases, type ReferenceCase } from "../helpers/reference.js";

const m = (v: number) => v as Length;
const hz = (v: number) => v as Frequency;
const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);
const ETA0 = constant("vacuumImpedance").value; // CODATA 2022

interface Strip { u: number; er: number; t?: number; f?: number; h?: number }
const z = (x: Strip) =>
  microstripImpedance({ width: m(x.u * (x.h ?? 1e-3)), height: m(x.h ?? 1e-3), relativePermittivity: x.er, thickness: m((x.t ?? 0) * (x.h ?? 1e-3)), frequency: hz(x.f ?? 0) });
const ee = (x: Strip) =>
  microstripEffectivePermittivity({ width: m(x.u * (x.h ?? 1e-3)), height: m(x.h ?? 1e-3), relativePermittivity: x.er, thickness: m((x.t ?? 0) * (x.h ?? 1e-3)), frequency: hz(x.f ?? 0) });

describe("microstrip against published values", () => {
  it("the 50-ohm line on a 2.2 substrate has the width ratio and effective permittivity of Pozar's worked example", () => {
    const src =
      "D. M. Pozar, Microwave Engineering, 4th ed. (2012), Example 3.7: epsr 2.20, d = 0.127 cm, 50 ohm at W/d = 3.081, eps_e = 1.87 (from memory); Pozar's closed forms are Hammerstad's earlier fits, about 1 % from H&J 1980";
    const zc: ReferenceCase<Strip>[] = [{ name: "Z0 at W/d = 3.081", input: { u: 3.081, er: 2.2, h: 1.27e-3 }, expected: 50, tolerance: 0.01, source: src }];
    const ec: ReferenceCase<Strip>[] = [{ name: "eps_eff at W/d = 3.081", input: { u: 3.081, er: 2.2, h: 1.27e-3 }, expected: 1.87, tolerance: 0.01, source: src }];
    checkCases(zc, z);
    checkCases(ec, ee);
  });

  it("a strip as wide as the substrate is thick in air is about 126 ohm, and 50 ohm on alumina needs w about h", () => {
    const cases: ReferenceCase<Strip>[] = [
      {
        name: "air microstrip, w/h = 1", input: { u: 1, er: 1 }, expected: 126, tolerance: 0.005,
        source: "H. A. Wheeler, Transmission-line properties of a strip on a dielectric sheet on a plane, IEEE Trans. MTT 25(8) (1977), curves of Z0 against w/h: about 126 ohm at w/h = 1 in air (from memory)",
      },
      {
        name: "alumina epsr 9.8, w/h = 0.95", input: { u: 0.95, er: 9.8 }, expected: 50, tolerance: 0.02,
        source: "common practice: on 99.6 % alumina (epsr 9.8) a 50-ohm microstrip has w/h of about 0.95 (from memory)",
      },
    ];
    checkCases(cases, z);
  });

  it("a very wide strip tends to the parallel-plate line eta0 h / (w sqrt(epsr))", () => {
    // The exact parallel-plate limit (fringing vanishes as w/h grows): Z0 -> eta0 h / w and eps_eff -> epsr.
    for (const er of [1, 4.4, 10]) {
      expect(rel(z({ u: 1e4, er }), ETA0 / 1e4 / Math.sqrt(er))).toBeLessThan(2e-3);
      expect(rel(ee({ u: 1e4, er }), er)).toBeLessThan(2e-3);
    }
  });
});

const u = fc.double({ min: 0.05, max: 50, noNaN: true });
const er = fc.double({ min: 1, max: 20, noNaN: true });
const tRatio = fc.double({ min: 1e-4, max: 0.1, noNaN: true });
const fn = fc.double({ min: 0.01, max: 30, noNaN: true }); // GHz mm

describe("microstrip properties", () => {
  it("in air the effective permittivity is 1 at every width, thickness and frequency", () => {
    fc.assert(fc.property(u, tRatio, fn, (w, t, f) => {
      expect(rel(ee({ u: w, er: 1, t, f: f * 1e9 }), 1)).toBeLessThan(4 * Number.EPSILON);
    }));
  });

  it("the effective permittivity lies between (epsr + 1)/2 and epsr at 0 Hz, for widths within the paper's range", () => {
    fc.assert(fc.property(fc.double({ min: 0.01, max: 100, noNaN: true }), er, (w, e) => {
      const v = ee({ u: w, er: e });
      expect(v).toBeGreaterThanOrEqual((e + 1) / 2 * (1 - 1e-12));
      expect(v).toBeLessThanOrEqual(e * (1 + 1e-12));
    }));
  });

  it("impedance falls as the strip widens or the permittivity rises; the effective permittivity rises with both", () => {
    fc.assert(fc.property(u, er, fc.double({ min: 1.01, max: 3, noNaN: true }), (w, e, k) => {
      expect(z({ u: w * k, er: e })).toBeLessThan(z({ u: w, er: e }));
      expect(z({ u: w, er: e * k })).toBeLessThan(z({ u: w, er: e }));
      expect(ee({ u: w * k, er: e })).toBeGreaterThan(ee({ u: w, er: e }) * (1 - 1e-15));
    }));
  });

  it("a thicker strip behaves as a wider one: lower impedance, and a thickness tending to 0 gives the thin-strip values", () => {
    fc.assert(fc.property(u, er, tRatio, (w, e, t) => {
      expect(z({ u: w, er: e, t })).toBeLessThan(z({ u: w, er: e }));
      expect(rel(z({ u: w, er: e, t: 1e-15 }), z({ u: w, er: e }))).toBeLessThan(1e-12);
      expect(rel(ee({ u: w, er: e, t: 1e-15 }), ee({ u: w, er: e }))).toBeLessThan(1e-12);
    }));
  });

  it("dispersion: the effective permittivity grows with frequency towards epsr and is continuous at 0 Hz", () => {
    fc.assert(fc.property(fc.double({ min: 0.1, max: 20, noNaN: true }), fc.double({ min: 1.5, max: 20, noNaN: true }), fn, (w, e, f) => {
      const lo = ee({ u: w, er: e, f: f * 1e9 });
      const hi = ee({ u: w, er: e, f: 1.5 * f * 1e9 });
      expect(hi).toBeGreaterThan(lo);
      expect(hi).toBeLessThan(e);
      expect(rel(ee({ u: w, er: e, f: 1 }), ee({ u: w, er: e }))).toBeLessThan(1e-9);
      expect(rel(z({ u: w, er: e, f: 1 }), z({ u: w, er: e }))).toBeLessThan(1e-6);
    }));
    // Far above the model's range it still tends to epsr (the limit of K&J's form).
    expect(rel(ee({ u: 1, er: 9.8, f: 1e15 }), 9.8)).toBeLessThan(1e-6);
  });

  it("near air (1 < epsr < 1.1) the frequency-dependent impedance neither swings nor fails, joins the model at 1.1 and tends to the air value", () => {
    // Jansen and Kirschning's (R13/R14)^R17 passes through 0/0 for substrates near 1.02-1.05: before the
    // interpolation below 1.1, w/h = 1 at f h = 39 GHz mm gave 77 ohm at epsr 1.025 and 223 ohm at 1.035
    // (quasi-static 125 ohm), and NaN (out_of_range) between. Now the frequency factor Z(f)/Z(0) stays
    // between 1 and its value at 1.1.
    fc.assert(fc.property(fc.double({ min: 0.1, max: 20, noNaN: true }), fc.double({ min: 1 + 1e-9, max: 1.1 - 1e-9, noNaN: true }), fc.double({ min: 0.1, max: 39, noNaN: true }), (w, e, f) => {
      const ratio = z({ u: w, er: e, f: f * 1e9 }) / z({ u: w, er: e });
      const at11 = z({ u: w, er: 1.1, f: f * 1e9 }) / z({ u: w, er: 1.1 });
      expect(Math.abs(Math.log(ratio))).toBeLessThanOrEqual(Math.abs(Math.log(at11)) * (1 + 1e-12));
      expect(Math.sign(Math.log(ratio))).toBe(Math.sign(Math.log(at11)));
    }));
    for (const w of [0.1, 1, 10]) {
      // Continuous at 1.1 (the model itself above, the interpolation below).
      expect(rel(z({ u: w, er: 1.1 * (1 - 1e-12), f: 3e10 }), z({ u: w, er: 1.1, f: 3e10 }))).toBeLessThan(1e-10);
      // Tends to the air value, which has no dispersion.
      expect(rel(z({ u: w, er: 1 + 1e-12, f: 3e10 }), z({ u: w, er: 1, f: 3e10 }))).toBeLessThan(1e-10);
    }
    const r = evaluate("microstripImpedance", { width: "1 mm", height: "1 mm", relativePermittivity: 1.03, frequency: "38 GHz" });
    expect(r.warnings.map((x) => x.code)).toEqual(["near_air_substrate"]);
    expect(r.value as number).toBeGreaterThan(125);
    expect(r.value as number).toBeLessThan(140);
    // The effective permittivity (Kirschning and Jansen 1982) is regular there and gets no such warning.
    expect(evaluate("microstripEffectivePermittivity", { width: "1 mm", height: "1 mm", relativePermittivity: 1.03, frequency: "38 GHz" }).warnings).toEqual([]);
  });

  it("depends on the geometry only through ratios, and on frequency only through f h", () => {
    fc.assert(fc.property(u, er, tRatio, fn, fc.integer({ min: -40, max: 40 }), (w, e, t, f, k) => {
      const s = 2 ** k;
      const a = { u: w, er: e, t, f: f * 1e9 };
      const b = { ...a, h: 1e-3 * s, f: (f * 1e9) / s };
      expect(rel(z(b), z(a))).toBeLessThan(1e-13);
      expect(rel(ee(b), ee(a))).toBeLessThan(1e-13);
    }));
  });
});

describe("microstrip through evaluate", () => {
  it("unit strings give the typed value, defaults fill thickness and frequency", () => {
    const typed = microstripImpedance({ width: quantity(3, "mm"), height: quantity(1.6, "mm"), relativePermittivity: 4.4 });
    const r = evaluate("microstripImpedance", { width: "3 mm", height: "1.6 mm", relativePermittivity: 4.4 });
    expect(r.value).toBe(typed);
    expect(r.unit).toBe("ohm");
    const e = evaluate("microstripEffectivePermittivity", { width: "0.3 mm", height: "0.16 mm", relativePermittivity: 4.4, thickness: "35 um", frequency: "2.4 GHz" });
    expect(e.value as number).toBeGreaterThan(2.7);
    expect(e.value as number).toBeLessThan(4.4);
  });

  it("warns outside the ranges the papers state", () => {
    const codes = (inputs: Record<string, string | number>) => evaluate("microstripImpedance", inputs).warnings.map((w) => w.code);
    expect(codes({ width: "1 mm", height: "1 mm", relativePermittivity: 4.4 })).toEqual([]);
    expect(codes({ width: "1 um", height: "1 mm", relativePermittivity: 4.4 })).toContain("width_ratio");
    expect(codes({ width: "1 mm", height: "1 mm", relativePermittivity: 200 })).toContain("permittivity_range");
    expect(codes({ width: "1 mm", height: "1 mm", relativePermittivity: 4.4, thickness: "0.3 mm" })).toContain("thick_strip");
    expect(codes({ width: "1 mm", height: "1 mm", relativePermittivity: 4.4, frequency: "50 GHz" })).toContain("dispersion_range");
    expect(codes({ width: "1 mm", height: "1 mm", relativePermittivity: 9.8, frequency: "40 GHz" })).toContain("higher_modes");
  });

  it("bad input is a coded error naming the input", () => {
    const good = { width: 1e-3, height: 1e-3, relativePermittivity: 4.4 };
    expect(expectFormulaError(() => evaluate("microstripImpedance", { ...good, width: -1 })).input).toBe("width");
    expect(expectFormulaError(() => evaluate("microstripImpedance", { ...good, height: 0 })).input).toBe("height");
    expect(expectFormulaError(() => evaluate("microstripImpedance", { ...good, relativePermittivity: 0.5 })).input).toBe("relativePermittivity");
    expect(expectFormulaError(() => evaluate("microstripImpedance", { ...good, thickness: -1e-6 })).input).toBe("thickness");
    expect(expectFormulaError(() => evaluate("microstripEffectivePermittivity", { ...good, frequency: -1 })).input).toBe("frequency");
    expect(expectFormulaError(() => evaluate("microstripEffectivePermittivity", { ...good, frequency: "1 mm" })).input).toBe("frequency");
  });

  it("refuses strips narrower than 1e-6 of the substrate, where the fit's exponent fails, and stays between (epsr+1)/2 and epsr down to it", () => {
    // Bound of H&J eq. (3) for 0 < a(u) b(epsr): the power (1 + 10/u)^(-ab) lies in (0, 1).
    for (const id of ["microstripImpedance", "microstripEffectivePermittivity"]) {
      for (const w of [1e-7, 1e-12, 1e-200]) {
        expect(expectFormulaError(() => evaluate(id, { width: w, height: 1, relativePermittivity: 4.4, frequency: 1e9 })).code).toBe("out_of_domain");
      }
    }
    for (const u of [1e-6, 1e-5, 1e-3]) {
      const ee = microstripEffectivePermittivity({ width: u as Length, height: 1 as Length, relativePermittivity: 4.4 });
      expect(ee).toBeGreaterThanOrEqual(2.7);
      expect(ee).toBeLessThanOrEqual(4.4);
    }
  });
});
