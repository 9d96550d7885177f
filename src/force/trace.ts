import { SPEED_OF_LIGHT } from "../constants/si.js";
import { FormulaError } from "../core/errors.js";
import { type LongRunOptions, ticker } from "../core/progress.js";
import type { Note } from "../core/spec.js";
import { countLoop } from "../math/loop-count.js";
import type { Charge, ElectricField, FluxDensity, Length, Mass, Time, Vec3, Velocity } from "../units/types.js";

const C = SPEED_OF_LIGHT;
const INV_C2 = 1 / (C * C);
const ID = "traceParticle";
/** Largest number of stored samples (3 Float64Arrays of 3 values each: about 560 MB). */
const MAX_SAMPLES = 1e7;
/**
 * Most time steps one call runs: the step loop's bound. At 5-20 ns per step with
 * uniform fields (bench/particle.ts) that is up to about 20 s; field functions cost more.
 */
export const MAX_STEPS = 1e9;
/** omega dt above which the result carries the `coarse_time_step` warning (see traceParticle). */
export const OMEGA_DT_LIMIT = 0.1;

/**
 * A field given as a function of position (m) and time (s), returning the
 * field's [x, y, z] components in SI (V/m for E, T for B).
 */
export type FieldFunction = (x: number, y: number, z: number, t: number) => ArrayLike<number>;

/** A uniform field (a typed 3-vector) or a function of position and time. */
export type FieldSource<Q extends number> = Vec3<Q> | FieldFunction;

/**
 * What `traceParticle` needs: the particle, where it starts, the fields and the time grid;
 * optionally `signal` (cancels the trace: FormulaError "cancelled") and `onProgress`
 * (time steps done of `steps`), as for every long call (core/progress.ts).
 */
export interface TraceOptions extends LongRunOptions {
  /** Charge and rest mass, e.g. a preset: `electron`, `proton`, `alphaParticle`. */
  readonly particle: { readonly charge: Charge; readonly mass: Mass };
  /** Start position, m. */
  readonly position: Vec3<Length>;
  /** Start velocity, m/s (speed below c). */
  readonly velocity: Vec3<Velocity>;
  /** Electric field: uniform vector or function; default none. */
  readonly electricField?: FieldSource<ElectricField>;
  /** Magnetic flux density: uniform vector or function; default none. */
  readonly fluxDensity?: FieldSource<FluxDensity>;
  /** Time step, s (positive). Keep omega dt <= 0.1, omega = |q| B / (gamma m); see `traceParticle`. */
  readonly timeStep: Time;
  /** Number of time steps (a whole number from 1 to MAX_STEPS = 1e9). */
  readonly steps: number;
  /** Store every n-th step (default 1: every step). */
  readonly sampleEvery?: number;
  /** Time of the start position, s (default 0). */
  readonly startTime?: Time;
}

/** A traced path: samples at t[i], with positions and velocities interleaved [x0, y0, z0, x1, ...]. */
/** The arrays are views into one ArrayBuffer; `slice()` one to keep or transfer it apart. */
export interface ParticleTrace {
  /** Sample times, s. */
  readonly t: Float64Array;
  /** Positions, m, three numbers per sample. */
  readonly positions: Float64Array;
  /** Velocities, m/s, three numbers per sample. */
  readonly velocities: Float64Array;
  /** Number of samples: floor(steps / sampleEvery) + 1 (the start included). */
  readonly samples: number;
  /**
   * Where the trace's accuracy ends: `coarse_time_step` when the largest omega dt met
   * (omega = |q| B / (gamma m), B at the particle) exceeds 0.1.
   */
  readonly warnings: readonly Note[];
}

function bad(input: string, value: unknown, detail: string): FormulaError {
  return new FormulaError("invalid_argument", { formula: ID, input, value, detail });
}

function finiteNumber(input: string, v: unknown): number {
  if (typeof v !== "number" || v - v !== 0) throw bad(input, v, "must be a finite number in SI units");
  return v;
}

function vector3(input: string, v: unknown): [number, number, number] {
  if (!Array.isArray(v) || v.length !== 3) throw bad(input, v, "must be a 3-vector [x, y, z] in SI units");
  return [finiteNumber(input, v[0]), finiteNumber(input, v[1]), finiteNumber(input, v[2])];
}

function wholeNumber(input: string, v: unknown, min: number, max: number): number {
  if (typeof v !== "number" || !Number.isInteger(v) || v < min || v > max) {
    throw bad(input, v, `must be a whole number from ${min} to ${max}`);
  }
  return v;
}

/**
 * Trace a charged particle through electric and magnetic fields with the
 * relativistic Boris pusher.
 *
 * Each step of length dt (drift-kick-drift form, positions and velocities at
 * the same times): half a drift x += (dt/2) u/gamma; fields at that midpoint and
 * mid-time; half an electric kick u- = u + (q dt / 2m) E; the magnetic rotation
 * t = (q dt / (2 m gamma-)) B, s = 2 t / (1 + t^2), u' = u- + u- x t,
 * u+ = u- + u' x s; the second half kick u = u+ + (q dt / 2m) E; half a drift
 * with the new velocity. u = gamma v is the momentum per unit rest mass.
 *
 * Accuracy: second order in dt. The rotation preserves |u| exactly, so in a pure
 * magnetic field the speed is conserved to round-off over any number of steps,
 * and the scheme preserves phase-space volume (Qin et al. 2013), so energy
 * errors do not drift secularly. The rotation angle per step is
 * 2 atan(omega dt / 2) instead of omega dt (omega = |q| B / (gamma m)): the
 * gyration frequency is low by about (omega dt)^2 / 12, so omega dt <= 0.1
 * keeps it below 8.4e-4 relative (phase error 2 pi N times that after N turns),
 * and omega dt <= 0.01 below 8.4e-6. In a uniform B the sampled positions lie
 * on a circle of exactly the radius v/omega; in crossed uniform E and B the
 * guiding centre moves at exactly E x B / B^2 (non-relativistic speeds).
 *
 * Fields given as functions are called once per step at (x, y, z, t) of the
 * mid-step position in SI; they must return three finite numbers.
 *
 * References: J. P. Boris, "Relativistic plasma simulation - optimization of a
 * hybrid code", Proc. 4th Conf. Numerical Simulation of Plasmas (1970);
 * C. K. Birdsall, A. B. Langdon, Plasma Physics via Computer Simulation (1991),
 * sections 4-3 and 4-4 (from memory); H. Qin et al., "Why is Boris algorithm so
 * good?", Phys. Plasmas 20, 084503 (2013).
 *
 * The result's `warnings` carry `coarse_time_step` when the largest omega dt met along
 * the path (from the magnetic field actually seen at each step) exceeds 0.1.
 *
 * Errors: FormulaError "invalid_argument" naming the option (non-finite values,
 * steps not a whole number from 1 to MAX_STEPS, speed not below c, a field function returning
 * anything but three finite numbers); "out_of_range" if the motion overflows; "cancelled"
 * when `options.signal` is aborted (checked between blocks of steps: 16384 steps with
 * uniform fields, 1024 with field functions). `options.onProgress` counts time steps.
 *
 * @example
 * const path = traceParticle({ particle: electron, position: [0, 0, 0] as Vec3<Length>,
 *   velocity: [1e6, 0, 0] as Vec3<Velocity>, fluxDensity: [0, 0, 1e-3] as Vec3<FluxDensity>,
 *   timeStep: quantity(1e-10, "s"), steps: 1000 });
 * path.positions.length; // 3003: a circle of radius ≈ 5.686 mm
 */
export function traceParticle(options: TraceOptions): ParticleTrace {
  if (typeof options !== "object" || options === null) throw bad("options", options, "must be an options object");
  const p = options.particle as unknown;
  if (typeof p !== "object" || p === null) throw bad("particle", p, "must be { charge, mass }, e.g. the electron preset");
  const q = finiteNumber("particle.charge", (p as { charge: unknown }).charge);
  const m = finiteNumber("particle.mass", (p as { mass: unknown }).mass);
  if (!(m > 0)) throw bad("particle.mass", m, "must be positive");
  const [x0, y0, z0] = vector3("position", options.position);
  const v0 = vector3("velocity", options.velocity);
  const dt = finiteNumber("timeStep", options.timeStep);
  if (!(dt > 0)) throw bad("timeStep", dt, "must be positive");
  const steps = wholeNumber("steps", options.steps, 1, MAX_STEPS);
  const every = options.sampleEvery === undefined ? 1 : wholeNumber("sampleEvery", options.sampleEvery, 1, Number.MAX_SAFE_INTEGER);
  const t0 = options.startTime === undefined ? 0 : finiteNumber("startTime", options.startTime);
  const samples = Math.floor(steps / every) + 1;
  if (samples > MAX_SAMPLES) throw bad("sampleEvery", every, `stores ${samples} samples, more than ${MAX_SAMPLES}; raise sampleEvery`);
  if (!Number.isFinite(t0 + steps * dt)) throw bad("timeStep", dt, "the end time is not finite");

  const speed = Math.hypot(v0[0], v0[1], v0[2]);
  const b = speed / C;
  if (!(b < 1)) throw bad("velocity", speed, "speed must be below c");
  // gamma = 1/sqrt((1 - b)(1 + b)): exact near b = 1, where 1 - b^2 would round.
  const g0 = 1 / Math.sqrt((1 - b) * (1 + b));

  const eField = fieldOf("electricField", options.electricField);
  const bField = fieldOf("fluxDensity", options.fluxDensity);
  const progress = ticker(ID, options, steps);

  // One allocation for the three arrays: fresh typed arrays cost more than the
  // steps that fill them on short traces (bench/particle.ts).
  const buffer = new ArrayBuffer(56 * samples);
  const t = new Float64Array(buffer, 0, samples);
  const pos = new Float64Array(buffer, 8 * samples, 3 * samples);
  const vel = new Float64Array(buffer, 32 * samples, 3 * samples);
  t[0] = t0;
  pos[0] = x0; pos[1] = y0; pos[2] = z0;
  vel[0] = v0[0]; vel[1] = v0[1]; vel[2] = v0[2];

  // State carried between chunks: x, y, z, ux, uy, uz (u = gamma v), gamma, next sample index, steps to it,
  // and the largest |t|^2 met (t = tan of half the rotation angle, |t| ~ omega dt / 2).
  const st = new Float64Array([x0, y0, z0, g0 * v0[0], g0 * v0[1], g0 * v0[2], g0, 1, every, 0]);
  const uniform = new Float64Array([...(eField.uniform ?? [0, 0, 0]), ...(bField.uniform ?? [0, 0, 0])]);
  const kick = (q / m) * 0.5 * dt;
  const eFn = eField.fn, bFn = bField.fn;
  // Short chunks: the kernel is then optimized as a whole from full type feedback instead of
  // by on-stack replacement in the middle of one long loop (which deoptimizes at its exit).
  // Plain arguments, no options object: nothing whose shape can invalidate the optimized code.
  // The loop runs ceil(steps / CHUNK) times, each call exactly its chunk's steps: steps <= MAX_STEPS in all.
  // Progress ticks every TICK_STEPS (fewer with field functions, whose calls cost more than a step).
  const tickMask = (eFn !== undefined || bFn !== undefined ? TICK_STEPS_WITH_FUNCTIONS : TICK_STEPS) - 1;
  for (let n0 = 0; n0 < steps; n0 += CHUNK) {
    if ((n0 & tickMask) === 0) progress.tick(n0);
    borisSteps(st, uniform, eFn, bFn, t0, dt, kick, every, t, pos, vel, n0, Math.min(steps, n0 + CHUNK));
  }
  countLoop(steps);
  const warnings = stepWarnings(st[9]!);
  progress.finish();
  return { t, positions: pos, velocities: vel, samples, warnings };
}

/**
 * The Boris rotation turns u by 2 atan(|t|) per step with |t| = omega dt / 2 exactly
 * (t = (q dt / (2 m gamma)) B), so omega dt = 2 |t|; the lag is 1 - 2 atan(omega dt / 2) / (omega dt).
 */
function stepWarnings(t2max: number): Note[] {
  const omegaDt = 2 * Math.sqrt(t2max);
  if (!(omegaDt > OMEGA_DT_LIMIT)) return [];
  const lag = 1 - (2 * Math.atan(omegaDt / 2)) / omegaDt; // about (omega dt)^2 / 12 while small
  return [
    {
      code: "coarse_time_step",
      message: `omega dt reaches ${omegaDt.toPrecision(3)} (omega = |q| B / (gamma m)), above ${OMEGA_DT_LIMIT}: the Boris rotation per step, 2 atan(omega dt / 2), lags the true gyration omega dt by ${(100 * lag).toPrecision(2)} % (about (omega dt)^2 / 12), so phases and orbits drift; shorten timeStep until omega dt <= ${OMEGA_DT_LIMIT}`,
    },
  ];
}

/** Steps per kernel call. */
const CHUNK = 256;
/**
 * Steps between progress ticks with uniform fields (a multiple of CHUNK and a power of 2):
 * 0.2-0.5 ms at 10-30 ns a step (bench/particle.ts).
 */
const TICK_STEPS = 64 * CHUNK;
/** The same with a field function, called once per step: a multiple of CHUNK and a power of 2. */
const TICK_STEPS_WITH_FUNCTIONS = 4 * CHUNK;

/**
 * Boris steps n0+1 .. n1 (drift-kick-rotate-kick-drift), state in `st`, uniform E and B in
 * `uniform`; kick = (q/m)(dt/2); samples every `every` steps into t, pos, vel.
 */
function borisSteps(
  st: Float64Array, uniform: Float64Array, eFn: FieldFunction | undefined, bFn: FieldFunction | undefined,
  t0: number, dt: number, kick: number, every: number, t: Float64Array, pos: Float64Array, vel: Float64Array,
  n0: number, n1: number,
): void {
  const h = 0.5 * dt;
  let x = st[0]!, y = st[1]!, z = st[2]!, ux = st[3]!, uy = st[4]!, uz = st[5]!, gamma = st[6]!;
  // Small integers kept as int32 so the sample stores are plain indexed stores.
  let k = st[7]! | 0, untilSample = st[8]! | 0;
  let t2max = st[9]!;
  // Field components as plain locals: uniform fields never leave registers.
  let ex = uniform[0]!, ey = uniform[1]!, ez = uniform[2]!, bx = uniform[3]!, by = uniform[4]!, bz = uniform[5]!;
  for (let n = n0 + 1; n <= n1; n++) {
    // Half drift to the mid-step position.
    let ig = 1 / gamma;
    x += h * ux * ig; y += h * uy * ig; z += h * uz * ig;
    if (eFn !== undefined) {
      read(eFn, "electricField", x, y, z, t0 + (n - 0.5) * dt, uniform, 0);
      ex = uniform[0]!; ey = uniform[1]!; ez = uniform[2]!;
    }
    if (bFn !== undefined) {
      read(bFn, "fluxDensity", x, y, z, t0 + (n - 0.5) * dt, uniform, 3);
      bx = uniform[3]!; by = uniform[4]!; bz = uniform[5]!;
    }
    // Half electric kick.
    const umx = ux + kick * ex, umy = uy + kick * ey, umz = uz + kick * ez;
    // Magnetic rotation of u- by angle 2 atan(|t|); preserves |u| exactly in exact arithmetic.
    const f = kick / Math.sqrt(1 + (umx * umx + umy * umy + umz * umz) * INV_C2);
    const tx = f * bx, ty = f * by, tz = f * bz;
    const t2 = tx * tx + ty * ty + tz * tz;
    if (t2 > t2max) t2max = t2;
    const s = 2 / (1 + t2);
    const upx = umx + (umy * tz - umz * ty);
    const upy = umy + (umz * tx - umx * tz);
    const upz = umz + (umx * ty - umy * tx);
    const rx = umx + s * (upy * tz - upz * ty);
    const ry = umy + s * (upz * tx - upx * tz);
    const rz = umz + s * (upx * ty - upy * tx);
    // Second half electric kick.
    ux = rx + kick * ex; uy = ry + kick * ey; uz = rz + kick * ez;
    gamma = Math.sqrt(1 + (ux * ux + uy * uy + uz * uz) * INV_C2);
    if (!(gamma < 1e300)) throw overflow(n); // also catches NaN
    // Half drift with the new velocity.
    ig = 1 / gamma;
    x += h * ux * ig; y += h * uy * ig; z += h * uz * ig;
    if (--untilSample === 0) {
      untilSample = every;
      t[k] = t0 + n * dt;
      const j = 3 * k;
      pos[j] = x; pos[j + 1] = y; pos[j + 2] = z;
      vel[j] = ux * ig; vel[j + 1] = uy * ig; vel[j + 2] = uz * ig;
      k++;
    }
  }
  // Positions overflow only for absurd time spans; non-finite values propagate, so checking once per chunk suffices.
  if (!(x - x === 0 && y - y === 0 && z - z === 0)) throw overflow(n1);
  st[0] = x; st[1] = y; st[2] = z; st[3] = ux; st[4] = uy; st[5] = uz; st[6] = gamma; st[7] = k; st[8] = untilSample; st[9] = t2max;
}

interface ResolvedField {
  readonly uniform?: readonly number[];
  readonly fn?: FieldFunction;
}

function fieldOf(input: string, f: unknown): ResolvedField {
  if (f === undefined) return { uniform: [0, 0, 0] };
  if (typeof f === "function") return { fn: f as FieldFunction };
  return { uniform: vector3(input, f) };
}

function overflow(n: number): FormulaError {
  return new FormulaError("out_of_range", { formula: ID, detail: `the motion overflowed by step ${n}` });
}

function read(fn: FieldFunction, input: string, x: number, y: number, z: number, t: number, out: Float64Array, at: number): void {
  const r = fn(x, y, z, t);
  const a = r?.[0], b = r?.[1], c = r?.[2];
  if (r?.length !== 3 || typeof a !== "number" || typeof b !== "number" || typeof c !== "number" || a - a !== 0 || b - b !== 0 || c - c !== 0) {
    throw bad(input, undefined, `the field function must return three finite numbers; at (${x}, ${y}, ${z}) m, t = ${t} s it did not`);
  }
  out[at] = a; out[at + 1] = b; out[at + 2] = c;
}
