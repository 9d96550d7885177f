/**
 * Particle tracing throughput: traceParticle (relativistic Boris pusher, option
 * checks, Float64Array samples) against a plain hand-written relativistic Boris
 * loop (same drift-kick-rotate-kick-drift steps) on the same uniform-field
 * problem, both storing every step in fresh arrays.
 * Reported as steps per second and the time ratio. Random start velocities.
 */
import { traceParticle, type FluxDensity, type Length, type Time, type Vec3, type Velocity } from "../src/index.js";
import { type BenchRow, compare, ns, randomArray, times } from "./util.js";

const Q = -1.602176634e-19;
const M = 9.1093837139e-31;

const INV_C2 = 1 / (299792458 * 299792458);

/**
 * Relativistic Boris in uniform B (drift-kick-drift form), every step stored
 * in fresh arrays (times, positions, velocities), as a tracer returning a
 * trajectory must.
 */
function plainLoop(
  v0: readonly number[], b: readonly number[], dt: number, steps: number,
  time = new Float64Array(steps + 1), pos = new Float64Array(3 * (steps + 1)), vel = new Float64Array(3 * (steps + 1)),
): number {
  let x = 0, y = 0, z = 0;
  const g0 = 1 / Math.sqrt(1 - (v0[0]! ** 2 + v0[1]! ** 2 + v0[2]! ** 2) * INV_C2);
  let ux = g0 * v0[0]!, uy = g0 * v0[1]!, uz = g0 * v0[2]!, g = g0;
  const h = 0.5 * dt, kick = (Q / M) * h;
  for (let n = 1; n <= steps; n++) {
    x += (h * ux) / g; y += (h * uy) / g; z += (h * uz) / g;
    const f = kick / g; // pure B: gamma is unchanged by the kick
    const tx = f * b[0]!, ty = f * b[1]!, tz = f * b[2]!;
    const s = 2 / (1 + tx * tx + ty * ty + tz * tz);
    const px = ux + (uy * tz - uz * ty), py = uy + (uz * tx - ux * tz), pz = uz + (ux * ty - uy * tx);
    ux += s * (py * tz - pz * ty); uy += s * (pz * tx - px * tz); uz += s * (px * ty - py * tx);
    g = Math.sqrt(1 + (ux * ux + uy * uy + uz * uz) * INV_C2);
    x += (h * ux) / g; y += (h * uy) / g; z += (h * uz) / g;
    time[n] = n * dt;
    pos[3 * n] = x; pos[3 * n + 1] = y; pos[3 * n + 2] = z;
    vel[3 * n] = ux / g; vel[3 * n + 1] = uy / g; vel[3 * n + 2] = uz / g;
  }
  return x + vel[1]! + time[steps]!;
}

export async function run(): Promise<BenchRow[]> {
  const steps = 20_000;
  const B = [0, 0, 1e-3];
  const dt = 0.1 / ((1.602176634e-19 * 1e-3) / M);
  const starts = randomArray(3 * 64, -1e6, 1e6, 21);
  const reused = [new Float64Array(steps + 1), new Float64Array(3 * (steps + 1)), new Float64Array(3 * (steps + 1))] as const;
  let call = 0;
  const t = compare(
    {
      plain: () => {
        const i = 3 * (call++ & 63);
        return plainLoop([starts[i]!, starts[i + 1]!, starts[i + 2]!], B, dt, steps);
      },
      library: () => {
        const i = 3 * (call++ & 63);
        const tr = traceParticle({
          particle: { charge: Q as never, mass: M as never },
          position: [0, 0, 0] as unknown as Vec3<Length>,
          velocity: [starts[i]!, starts[i + 1]!, starts[i + 2]!] as unknown as Vec3<Velocity>,
          fluxDensity: B as unknown as Vec3<FluxDensity>,
          timeStep: dt as Time,
          steps,
        });
        return tr.positions[3 * steps]! + tr.velocities[1]!;
      },
      plainReused: () => {
        const i = 3 * (call++ & 63);
        return plainLoop([starts[i]!, starts[i + 1]!, starts[i + 2]!], B, dt, steps, ...reused);
      },
    },
    steps,
    21,
    10,
  );
  return [
    { name: "traceParticle steps per second", value: (1e9 / t.ns.library!).toExponential(2), note: `uniform B, every step stored; ${ns(t.ns.library!)} per step` },
    { name: "traceParticle vs plain Boris loop (time ratio)", value: times(t.ratio.library!), note: `plain relativistic Boris loop ${ns(t.ns.plain!)} per step, same fresh sample arrays (into reused arrays ${ns(t.ns.plainReused!)}); the library also applies E kicks and checks for overflow (lower is faster)` },
  ];
}
