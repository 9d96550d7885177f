import { describe, expect, it } from "vitest";
import {
  cyclotronFrequency, driftVelocity, FormulaError, gyroradius, loopField, relativisticGyroradius, traceParticle,
  type Current, type ElectricField, type Energy, type FluxDensity, type Length, type Time, type Vec3, type Velocity,
} from "../../src/index.js";
import { electron, proton } from "../../src/constants/index.js";
import { SPEED_OF_LIGHT } from "../../src/constants/si.js";
import { expectClose, relativeError } from "../helpers/reference.js";
import { C, D, E, ME } from "./oracle.js";
import { errorOf } from "../helpers/errors.js";
import { loopCount, resetLoopCount } from "../helpers/loop-count.js";
import { MAX_STEPS, OMEGA_DT_LIMIT } from "../../src/force/trace.js";

const c = SPEED_OF_LIGHT;
const len = (v: readonly number[]) => v as unknown as Vec3<Length>;
const vel = (v: readonly number[]) => v as unknown as Vec3<Velocity>;
const fieldB = (v: readonly number[]) => v as unknown as Vec3<FluxDensity>;
const fieldE = (v: readonly number[]) => v as unknown as Vec3<ElectricField>;
const s = (v: number) => v as Time;
const T = (v: number) => v as FluxDensity;

/** Lorentz factor 1/sqrt(1 - (v/c)^2). */
function lorentz(v: number): number {
  const b = v / SPEED_OF_LIGHT;
  return 1 / Math.sqrt((1 - b) * (1 + b));
}

function sampleAt(a: Float64Array, i: number): [number, number, number] {
  return [a[3 * i]!, a[3 * i + 1]!, a[3 * i + 2]!];
}

/** Time step giving exactly `m` Boris steps per gyration: 2 atan(omega dt / 2) = 2 pi / m. */
function stepForTurn(omega: number, m: number): number {
  return (2 / omega) * Math.tan(Math.PI / m);
}

/** [code, input] of the FormulaError thrown. */
function codeOf(fn: () => unknown): [string | undefined, string | undefined] {
  const e = errorOf(fn);
  return [e?.code, e?.input];
}

describe("traceParticle in a uniform magnetic field", () => {
  const B = 1e-3;
  const omega = 2 * Math.PI * cyclotronFrequency({ charge: electron.charge, mass: electron.mass, fluxDensity: T(B) });

  it("returns times, positions and velocities of the right lengths, as views into one buffer", () => {
    const tr = traceParticle({ particle: electron, position: len([1, 2, 3]), velocity: vel([1e5, 0, 0]), fluxDensity: fieldB([0, 0, 1e-3]), timeStep: s(1e-12), steps: 10, sampleEvery: 3 });
    expect(tr.samples).toBe(4);
    expect([tr.t.length, tr.positions.length, tr.velocities.length]).toEqual([4, 12, 12]);
    expect(tr.positions.buffer).toBe(tr.t.buffer);
    expect(tr.velocities.buffer).toBe(tr.t.buffer);
    expect([...sampleAt(tr.positions, 0)]).toEqual([1, 2, 3]);
    expect([...sampleAt(tr.velocities, 0)]).toEqual([1e5, 0, 0]);
    expect(tr.t[3]).toBeCloseTo(9e-12, 25);
  });

  it("conserves the speed to round-off over 1e5 steps (Boris rotation preserves |u|)", () => {
    const v0 = [1e6, 0, 2e5];
    const tr = traceParticle({ particle: electron, position: len([0, 0, 0]), velocity: vel(v0), fluxDensity: fieldB([0, 0, B]), timeStep: s(0.1 / omega), steps: 100_000, sampleEvery: 100 });
    expect(tr.samples).toBe(1001);
    const speed0 = Math.hypot(...v0);
    let worst = 0;
    for (let i = 0; i < tr.samples; i++) worst = Math.max(worst, relativeError(Math.hypot(...sampleAt(tr.velocities, i)), speed0));
    expect(worst).toBeLessThan(1e-12);
    // The parallel velocity is untouched by a field along z.
    expect(tr.velocities[3 * 1000 + 2]).toBeCloseTo(2e5, 6);
  });

  it("moves on a circle of exactly the gyroradius (drift-kick-drift Boris keeps r = v/omega)", () => {
    const m = 200;
    const v = 1e6;
    const tr = traceParticle({ particle: electron, position: len([0, 0, 0]), velocity: vel([v, 0, 0]), fluxDensity: fieldB([0, 0, B]), timeStep: s(stepForTurn(omega / lorentz(v), m)), steps: 3 * m });
    let cx = 0, cy = 0;
    for (let i = 0; i < m; i++) { cx += tr.positions[3 * i]!; cy += tr.positions[3 * i + 1]!; }
    cx /= m; cy /= m;
    // The pusher is relativistic: the radius is gamma m v/(|q| B), gamma - 1 = 5.6e-6 here.
    const r = gyroradius({ mass: electron.mass, speed: v as Velocity, charge: electron.charge, fluxDensity: T(B) }) * lorentz(v);
    for (let i = 0; i <= 3 * m; i++) {
      expectClose(Math.hypot(tr.positions[3 * i]! - cx, tr.positions[3 * i + 1]! - cy), { expected: r, tolerance: 1e-10, source: "gyroradius m v/(|q| B) times gamma" });
    }
    // After exactly m steps the orbit closes: the step was chosen so the Boris angle is 2 pi / m.
    expect(Math.hypot(tr.positions[3 * m]!, tr.positions[3 * m + 1]!)).toBeLessThan(1e-10 * r);
    // An electron (q < 0) gyrates counter-clockwise seen from +B: starting along +x it turns toward +y.
    expect(tr.positions[3 * 10 + 1]!).toBeGreaterThan(0);
  });

  it("gyrates at the cyclotron frequency less the Boris phase error (omega dt)^2/12", () => {
    // Relativistic gyration frequency of a 1e6 m/s electron: omega / gamma.
    const w = omega / lorentz(1e6);
    const wdt = 0.1;
    const dt = wdt / w;
    const steps = 20_000;
    const tr = traceParticle({ particle: electron, position: len([0, 0, 0]), velocity: vel([1e6, 0, 0]), fluxDensity: fieldB([0, 0, B]), timeStep: s(dt), steps });
    // Unwrapped phase of the velocity vector.
    let phase = 0;
    for (let i = 1; i <= steps; i++) {
      const [ax, ay] = sampleAt(tr.velocities, i - 1);
      const [bx, by] = sampleAt(tr.velocities, i);
      phase += Math.atan2(ax * by - ay * bx, ax * bx + ay * by);
    }
    const measured = phase / (steps * dt);
    // Boris rotation per step: 2 atan(omega dt / 2) (Boris 1970; Birdsall & Langdon).
    expectClose(measured, { expected: (2 / dt) * Math.atan(wdt / 2), tolerance: 1e-12, source: "Boris rotation angle 2 atan(omega dt/2)" });
    const frequencyError = 1 - measured / w;
    expectClose(frequencyError, { expected: wdt * wdt / 12, tolerance: 0.01, source: "series of 2 atan(x/2)/x = 1 - x^2/12 + ..." });
  });
});

describe("traceParticle in crossed electric and magnetic fields", () => {
  it("drifts at E x B / B^2, the driftVelocity formula (exact over whole Boris turns)", () => {
    // Slow enough (v <= 2 E/B = 2e3 m/s) that relativistic terms, (v/c)^2 < 1e-10, stay below the tolerance.
    const Bz = 0.01, Ex = 10;
    const omega = 2 * Math.PI * cyclotronFrequency({ charge: proton.charge, mass: proton.mass, fluxDensity: T(Bz) });
    const m = 100;
    const dt = stepForTurn(omega, m);
    const turns = 50;
    const tr = traceParticle({ particle: proton, position: len([0, 0, 0]), velocity: vel([0, 0, 0]), electricField: fieldE([Ex, 0, 0]), fluxDensity: fieldB([0, 0, Bz]), timeStep: s(dt), steps: m * turns });
    const vd = driftVelocity({ electricField: fieldE([Ex, 0, 0]), fluxDensity: fieldB([0, 0, Bz]) });
    for (let k = 1; k <= turns; k++) {
      const [x, y] = sampleAt(tr.positions, k * m);
      const t = tr.t[k * m]!;
      expectClose(y / t, { expected: vd[1]!, tolerance: 1e-9, source: "E x B drift, Jackson section 12.3" });
      expect(Math.abs(x)).toBeLessThan(1e-9 * Math.abs(vd[1]! * t));
    }
  });
});

describe("traceParticle for a relativistic electron", () => {
  it("moves on a circle of the relativistic gyroradius at the frequency |q| B/(gamma m)", () => {
    const B = 0.1;
    const mev = 1.602176634e-13 as Energy;
    const r = relativisticGyroradius({ mass: electron.mass, kineticEnergy: mev, charge: electron.charge, fluxDensity: T(B) });
    const fRel = cyclotronFrequency({ charge: electron.charge, mass: electron.mass, fluxDensity: T(B), kineticEnergy: mev });
    // Speed of a 1 MeV electron: v = c sqrt(1 - 1/gamma^2), gamma = 1 + T/(m c^2), in decimal.js.
    const gamma = D(1).plus(E.times(1e6).div(ME.times(C.pow(2))));
    const v = C.times(D(1).minus(D(1).div(gamma.pow(2))).sqrt()).toNumber();
    expect(v / c).toBeGreaterThan(0.9);
    const m = 400;
    const tr = traceParticle({ particle: electron, position: len([0, 0, 0]), velocity: vel([0, v, 0]), fluxDensity: fieldB([0, 0, B]), timeStep: s(stepForTurn(2 * Math.PI * fRel, m)), steps: 2 * m, sampleEvery: 2 });
    let cx = 0, cy = 0;
    for (let i = 0; i < m / 2; i++) { cx += tr.positions[3 * i]!; cy += tr.positions[3 * i + 1]!; }
    cx /= m / 2; cy /= m / 2;
    for (let i = 0; i < tr.samples; i++) {
      expectClose(Math.hypot(tr.positions[3 * i]! - cx, tr.positions[3 * i + 1]! - cy), { expected: r, tolerance: 1e-9, source: "relativisticGyroradius, Jackson section 12.2" });
      expectClose(Math.hypot(...sampleAt(tr.velocities, i)), { expected: v, tolerance: 1e-13, source: "speed conserved in pure B" });
    }
    // One turn in exactly m steps of the relativistic frequency: back at the start.
    expect(Math.hypot(...sampleAt(tr.positions, m / 2))).toBeLessThan(1e-9 * r);
  });
});

describe("traceParticle with field functions", () => {
  it("reflects at the mirror point predicted by the adiabatic invariant in a simple magnetic mirror", () => {
    // B = B0 (-x z/L^2, -y z/L^2, 1 + z^2/L^2): divergence-free; |B| on axis rises to 2 B0 at z = L.
    const B0 = 0.01, L = 0.1;
    const mirror = (x: number, y: number, z: number) => [(-B0 * x * z) / (L * L), (-B0 * y * z) / (L * L), B0 * (1 + (z * z) / (L * L))];
    // Pitch angle at z = 0 with sin^2 = 1/2: mu = m v_perp^2/(2B) conserved -> reflection where B = 2 B0, z = L
    // (adiabatic invariance of the magnetic moment, Jackson section 12.5).
    const v = 1e6;
    const vp = v / Math.SQRT2;
    const omegaMax = (2 * Math.abs(electron.charge) * B0) / electron.mass;
    const tr = traceParticle({ particle: electron, position: len([0, 0, 0]), velocity: vel([vp, 0, vp]), fluxDensity: mirror, timeStep: s(0.1 / omegaMax), steps: 30_000, sampleEvery: 5 });
    let zMax = -Infinity, reversed = false;
    for (let i = 0; i < tr.samples; i++) {
      zMax = Math.max(zMax, tr.positions[3 * i + 2]!);
      if (tr.velocities[3 * i + 2]! < 0) reversed = true;
      expectClose(Math.hypot(...sampleAt(tr.velocities, i)), { expected: v, tolerance: 1e-12, source: "a magnetic field does no work" });
    }
    expect(reversed).toBe(true);
    // Gyroradius / L is about 4e-3 here, so the guiding-centre prediction holds to about 1 %.
    expectClose(zMax, { expected: L, tolerance: 0.01, source: "adiabatic mirror point, Jackson section 12.5" });
  });

  it("takes the field of two coaxial loops from loopField (a mirror made of coils) and confines the particle", () => {
    const a = 0.05, zc = 0.1, I = 200 as Current;
    const coils = (x: number, y: number, z: number): number[] => {
      const rho = Math.hypot(x, y);
      let br = 0, bz = 0;
      for (const z0 of [-zc, zc]) {
        const b = loopField({ current: I, radius: a as Length, radialDistance: rho as Length, axialDistance: (z - z0) as Length });
        br += b[0]!; bz += b[1]!;
      }
      return rho === 0 ? [0, 0, bz] : [(br * x) / rho, (br * y) / rho, bz];
    };
    const axis = (z: number) => coils(0, 0, z)[2]!;
    const b0 = axis(0), bMax = axis(zc);
    expect(bMax / b0).toBeGreaterThan(2);
    // Pitch angle with sin^2 = 0.6 > b0/bMax: trapped; mirror point where B_axis = b0 / 0.6.
    const target = b0 / 0.6;
    let lo = 0, hi = zc;
    for (let k = 0; k < 80; k++) { const mid = (lo + hi) / 2; if (axis(mid) < target) lo = mid; else hi = mid; }
    // 2e4 m/s: gyroradius about 0.25 mm, small against the 50 mm coils (adiabatic).
    const v = 2e4;
    const vp = v * Math.sqrt(0.6), vz = v * Math.sqrt(0.4);
    const omega = (Math.abs(electron.charge) * target) / electron.mass;
    const tr = traceParticle({ particle: electron, position: len([0, 0, 0]), velocity: vel([vp, 0, vz]), fluxDensity: coils, timeStep: s(0.1 / omega), steps: 20_000, sampleEvery: 4 });
    let zMax = -Infinity, zMin = Infinity;
    for (let i = 0; i < tr.samples; i++) { zMax = Math.max(zMax, tr.positions[3 * i + 2]!); zMin = Math.min(zMin, tr.positions[3 * i + 2]!); }
    expect(zMin).toBeLessThan(-0.5 * lo); // it bounced back through the centre
    expectClose(zMax, { expected: lo, tolerance: 0.03, source: "adiabatic mirror point on the axis of the loopField coils" });
  });
});

describe("traceParticle option checks", () => {
  const base = { particle: electron, position: len([0, 0, 0]), velocity: vel([1e5, 0, 0]), fluxDensity: fieldB([0, 0, 1e-3]), timeStep: s(1e-11), steps: 10 };

  it("returns steps + 1 samples by default, and the start state first", () => {
    const tr = traceParticle(base);
    expect(tr.t.length).toBe(11);
    expect(tr.positions.length).toBe(33);
    expect(Array.from(tr.velocities.slice(0, 3))).toEqual([1e5, 0, 0]);
    expect(tr.t[10]).toBeCloseTo(1e-10, 20);
    expect(traceParticle({ ...base, sampleEvery: 3 }).samples).toBe(4);
  });

  it("rejects bad options with invalid_argument and the option's name", () => {
    expect(codeOf(() => traceParticle({ ...base, steps: 2.5 }))).toEqual(["invalid_argument", "steps"]);
    expect(codeOf(() => traceParticle({ ...base, steps: 0 }))).toEqual(["invalid_argument", "steps"]);
    expect(codeOf(() => traceParticle({ ...base, timeStep: s(NaN) }))).toEqual(["invalid_argument", "timeStep"]);
    expect(codeOf(() => traceParticle({ ...base, timeStep: s(-1e-9) }))).toEqual(["invalid_argument", "timeStep"]);
    expect(codeOf(() => traceParticle({ ...base, velocity: vel([c, 0, 0]) }))).toEqual(["invalid_argument", "velocity"]);
    expect(codeOf(() => traceParticle({ ...base, position: len([0, Infinity, 0]) }))).toEqual(["invalid_argument", "position"]);
    expect(codeOf(() => traceParticle({ ...base, fluxDensity: fieldB([0, 0]) }))).toEqual(["invalid_argument", "fluxDensity"]);
    expect(codeOf(() => traceParticle({ ...base, particle: { charge: electron.charge, mass: 0 as never } }))).toEqual(["invalid_argument", "particle.mass"]);
    expect(codeOf(() => traceParticle({ ...base, sampleEvery: 0 }))).toEqual(["invalid_argument", "sampleEvery"]);
    expect(codeOf(() => traceParticle({ ...base, steps: 1e9 }))).toEqual(["invalid_argument", "sampleEvery"]);
    expect(codeOf(() => traceParticle({ ...base, steps: MAX_STEPS + 1, sampleEvery: 1e6 }))).toEqual(["invalid_argument", "steps"]);
    expect(codeOf(() => traceParticle({ ...base, electricField: () => [0, NaN, 0] }))).toEqual(["invalid_argument", "electricField"]);
    expect(codeOf(() => traceParticle({ ...base, fluxDensity: () => [0, 0] }))).toEqual(["invalid_argument", "fluxDensity"]);
  });

  it("reports overflowing motion as out_of_range instead of returning Infinity", () => {
    expect(codeOf(() => traceParticle({ ...base, electricField: fieldE([1e300, 0, 0]), timeStep: s(1e10), steps: 5 }))[0]).toBe("out_of_range");
  });
});

describe("traceParticle's validity warning", () => {
  const base = { particle: electron, position: len([0, 0, 0]), velocity: vel([1e5, 0, 0]), steps: 100 };

  it("warns coarse_time_step for an electron at 0.01 T with a 1 ns step (omega dt = 1.76)", () => {
    // omega = e B / m_e = 1.759e9 rad/s at 0.01 T (CODATA 2022 e/m_e = 1.75882e11 C/kg), so omega dt = 1.76.
    const tr = traceParticle({ ...base, fluxDensity: fieldB([0, 0, 0.01]), timeStep: s(1e-9) });
    expect(tr.warnings.map((w) => w.code)).toEqual(["coarse_time_step"]);
    expect(tr.warnings[0]!.message).toContain("omega dt reaches 1.76");
    // The lag 1 - 2 atan(omega dt / 2) / (omega dt) is 18 % there.
    expect(tr.warnings[0]!.message).toContain("18 %");
  });

  it("is silent at omega dt = 0.0176 and warns just above the stated 0.1", () => {
    expect(traceParticle({ ...base, fluxDensity: fieldB([0, 0, 0.01]), timeStep: s(1e-11) }).warnings).toEqual([]);
    const omega = 1.75882001076e11 * 0.01; // e / m_e (CODATA 2018/2022, from memory) times B
    expect(traceParticle({ ...base, fluxDensity: fieldB([0, 0, 0.01]), timeStep: s(0.099 / omega) }).warnings).toEqual([]);
    expect(traceParticle({ ...base, fluxDensity: fieldB([0, 0, 0.01]), timeStep: s(0.101 / omega) }).warnings.length).toBe(1);
    expect(OMEGA_DT_LIMIT).toBe(0.1);
  });

  it("sees the field a particle meets along the way, not only at the start", () => {
    // B is zero at the start and 1 T beyond x = 1 mm: the warning comes from the steps there.
    const tr = traceParticle({
      ...base,
      velocity: vel([1e6, 0, 0]),
      fluxDensity: (x) => [0, 0, x > 1e-3 ? 1 : 0],
      timeStep: s(1e-10),
      steps: 100,
    });
    expect(tr.warnings.map((w) => w.code)).toEqual(["coarse_time_step"]);
  });

  it("reports its steps to the loop counter once", () => {
    resetLoopCount();
    traceParticle({ ...base, fluxDensity: fieldB([0, 0, 1e-3]), timeStep: s(1e-12), steps: 1000 });
    expect(loopCount()).toEqual({ total: 1000, largest: 1000 });
  });
});
