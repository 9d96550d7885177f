/**
 * Round wire AC resistance factor: a typed call over radius / skin depth spread
 * log-uniformly from 1e-3 to 1e6 (both methods: series below 12, Hankel's
 * expansion above), and over each region alone, against a typed skinDepth call
 * (same input checks, a closed form) on the same inputs. Random inputs, every result consumed.
 */
import { roundWireAcResistanceFactor, skinDepth, type Conductivity, type Frequency, type Length } from "../src/index.js";
import { type BenchRow, compare, ns, randomArray, times } from "./util.js";

const N = 4096;
const F = 1e5;
const SIGMA = 58e6 as Conductivity;
const DELTA = 1 / Math.sqrt(Math.PI * F * 1.25663706127e-6 * 58e6);

/** Diameters giving a / delta = 10^u for u uniform in [lo, hi]. */
function diameters(lo: number, hi: number, seed: number): Float64Array {
  const u = randomArray(N, lo, hi, seed);
  return u.map((e) => 2 * DELTA * 10 ** e);
}

function loops(d: Float64Array): Record<string, () => number> {
  return {
    skinDepth: () => {
      let s = 0;
      for (let i = 0; i < N; i++) s += skinDepth({ conductivity: SIGMA, frequency: (F * (1 + d[i]! * 1e-9)) as Frequency });
      return s;
    },
    factor: () => {
      let s = 0;
      for (let i = 0; i < N; i++) s += roundWireAcResistanceFactor({ diameter: d[i]! as Length, frequency: F as Frequency, conductivity: SIGMA });
      return s;
    },
  };
}

export async function run(): Promise<BenchRow[]> {
  const rows: BenchRow[] = [];
  for (const [label, lo, hi] of [["1e-3 to 1e6", -3, 6], ["1e-3 to 12 (series)", -3, Math.log10(12)], ["12 to 1e6 (Hankel)", Math.log10(12.01), 6]] as const) {
    const c = compare(loops(diameters(lo, hi, 7)), N);
    rows.push({
      name: `roundWireAcResistanceFactor, a/delta ${label}`,
      value: `${ns(c.ns.factor!)} per call`,
      note: `${times(c.ratio.factor!)} a typed skinDepth call (${ns(c.ns.skinDepth!)})`,
    });
  }
  return rows;
}
