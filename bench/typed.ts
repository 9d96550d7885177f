/**
 * Typed formula calls against the same arithmetic written on plain numbers.
 * The typed call checks every input's type, finiteness and domain, the
 * relations and the result's finiteness; the ratio shows what that costs.
 */
import { mulDiv } from "../src/math/scaled.js";
import { EPSILON0, MU0 } from "../src/constants/si.js";
import { coaxialCapacitance, longSolenoidInductance, parallelPlateCapacitance, solenoidInductance } from "../src/index.js";
import type { Area, Length } from "../src/units/types.js";
import { type BenchRow, compare, ns, randomArray, times } from "./util.js";

const N = 100_000;

export async function run(): Promise<BenchRow[]> {
  const rows: BenchRow[] = [];
  const area = randomArray(N, 1e-6, 1e-2, 1);
  const gap = randomArray(N, 1e-5, 1e-3, 2);
  const er = randomArray(N, 1, 10, 3);

  {
    const pp = parallelPlateCapacitance;
    const t = compare(
      {
        plain: () => {
          let s = 0;
          for (let i = 0; i < N; i++) s += (EPSILON0 * er[i]! * area[i]!) / gap[i]!;
          return s;
        },
        // The formula's own arithmetic on plain numbers: the product with its guard
        // against intermediate underflow and overflow, no input checks.
        guarded: () => {
          let s = 0;
          for (let i = 0; i < N; i++) s += mulDiv(EPSILON0, er[i]!, area[i]!, gap[i]!);
          return s;
        },
        typed: () => {
          let s = 0;
          for (let i = 0; i < N; i++) s += pp({ area: area[i]! as Area, gap: gap[i]! as Length, relativePermittivity: er[i]! });
          return s;
        },
      },
      N,
    );
    rows.push({ name: "typed parallelPlateCapacitance vs plain arithmetic", value: times(t.ratio.typed!), note: `typed ${ns(t.ns.typed!)}/call, plain ${ns(t.ns.plain!)} (target <= 1.1x); the same arithmetic with the formula's underflow guard ${ns(t.ns.guarded!)} = ${times(t.ratio.guarded!)}, the rest is checking the three inputs and the result` });
    rows.push({ name: "typed parallelPlateCapacitance vs its guarded arithmetic on plain numbers", value: times(t.ratio.typed! / t.ratio.guarded!), note: "what the input and result checks of a typed call add over the formula's own arithmetic" });
  }

  {
    const inner = randomArray(N, 1e-4, 1e-3, 4);
    const k = randomArray(N, 1.5, 10, 5);
    const outer = inner.map((a, i) => a * k[i]!);
    const len = randomArray(N, 0.1, 10, 6);
    const c2 = 2 * Math.PI * EPSILON0;
    const t = compare(
      {
        plain: () => {
          let s = 0;
          for (let i = 0; i < N; i++) s += (c2 * er[i]! * len[i]!) / Math.log(outer[i]! / inner[i]!);
          return s;
        },
        typed: () => {
          let s = 0;
          for (let i = 0; i < N; i++) {
            s += coaxialCapacitance({ innerRadius: inner[i]! as Length, outerRadius: outer[i]! as Length, length: len[i]! as Length, relativePermittivity: er[i]! });
          }
          return s;
        },
      },
      N,
    );
    rows.push({ name: "typed coaxialCapacitance vs plain arithmetic", value: times(t.ratio.typed!), note: `typed ${ns(t.ns.typed!)}/call, plain ${ns(t.ns.plain!)}; the typed compute also guards log(b/a) near 1 and intermediate overflow` });
  }

  {
    const turns = randomArray(N, 10, 2000, 7).map(Math.round);
    const radius = randomArray(N, 1e-3, 1e-1, 8);
    const len = randomArray(N, 0.1, 2, 9);
    const t = compare(
      {
        plain: () => {
          let s = 0;
          for (let i = 0; i < N; i++) s += MU0 * turns[i]! * turns[i]! * Math.PI * radius[i]! * (radius[i]! / len[i]!);
          return s;
        },
        typed: () => {
          let s = 0;
          for (let i = 0; i < N; i++) s += longSolenoidInductance({ turns: turns[i]!, radius: radius[i]! as Length, length: len[i]! as Length });
          return s;
        },
      },
      N,
    );
    rows.push({ name: "typed longSolenoidInductance vs plain arithmetic", value: times(t.ratio.typed!), note: `typed ${ns(t.ns.typed!)}/call, plain ${ns(t.ns.plain!)}; includes the whole-number check on turns` });
  }
  {
    // A formula heavier than a product (Nagaoka's coefficient through elliptic
    // integrals): its own compute on plain numbers, called with one reused
    // inputs object, against the typed call with its checks.
    const turns = randomArray(N, 10, 2000, 10).map(Math.round);
    const radius = randomArray(N, 1e-3, 1e-1, 11);
    const len = randomArray(N, 1e-3, 1, 12);
    const f = solenoidInductance;
    const x = f.inputsObject({ turns: 1, radius: 1, length: 1 }) as { turns: number; radius: number; length: number };
    const t = compare(
      {
        compute: () => {
          let s = 0;
          for (let i = 0; i < N; i++) {
            x.turns = turns[i]!; x.radius = radius[i]!; x.length = len[i]!;
            s += f.definition.compute(x);
          }
          return s;
        },
        typed: () => {
          let s = 0;
          for (let i = 0; i < N; i++) s += f({ turns: turns[i]!, radius: radius[i]! as Length, length: len[i]! as Length });
          return s;
        },
      },
      N,
    );
    rows.push({ name: "typed solenoidInductance vs its compute on plain numbers", value: times(t.ratio.typed!), note: `typed ${ns(t.ns.typed!)}/call, compute ${ns(t.ns.compute!)}; Nagaoka's coefficient through elliptic integrals, where the checks are a small part` });
  }
  return rows;
}
