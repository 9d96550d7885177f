/**
 * `evaluate` with unit strings against mathjs evaluating the same formula with
 * units: parsing the whole expression each time, and a compiled expression
 * called with mathjs Unit arguments. Unit strings repeat in real requests
 * ("0.1 mm"), which emquant's parse cache serves; fresh strings are measured too.
 */
import * as math from "mathjs";
import { evaluate } from "../src/index.js";
import { type BenchRow, compare, ns, randomArray, times } from "./util.js";

const POOL = 64;

export async function run(): Promise<BenchRow[]> {
  const a = randomArray(POOL, 0.5, 5, 11);
  const d = randomArray(POOL, 0.05, 0.5, 12);
  const areas = [...a].map((v) => `${v.toPrecision(4)} cm^2`);
  const gaps = [...d].map((v) => `${v.toPrecision(4)} mm`);
  const exprs = areas.map((s, i) => `8.8541878188e-12 F/m * 4.4 * (${s}) / (${gaps[i]})`);
  const compiled = math.compile("8.8541878188e-12 F/m * er * A / d");
  const areaUnits = areas.map((s) => math.unit(s));
  const gapUnits = gaps.map((s) => math.unit(s));

  const opsFast = 20_000;
  const opsSlow = 2_000;
  const per = (ops: number, body: (i: number) => number) => () => {
    let s = 0;
    for (let i = 0; i < ops; i++) s += body(i);
    return s;
  };
  // One interleaved comparison; each loop runs its own number of calls so rounds take similar time.
  const t = compare(
    {
      emquant: per(opsFast, (i) => evaluate("parallelPlateCapacitance", { area: areas[i % POOL]!, gap: gaps[i % POOL]!, relativePermittivity: 4.4 }).value as number),
      mathjsEvaluate: per(opsSlow, (i) => (math.evaluate(exprs[i % POOL]!) as math.Unit).toNumber("F")),
      mathjsCompiled: per(opsSlow, (i) => (compiled.evaluate({ er: 4.4, A: areaUnits[i % POOL], d: gapUnits[i % POOL] }) as math.Unit).toNumber("F")),
    },
    { emquant: opsFast, mathjsEvaluate: opsSlow, mathjsCompiled: opsSlow },
    11,
  );
  // Fresh strings every call: the parse cache cannot help.
  let counter = 0;
  const fresh = compare(
    {
      emquantFresh: per(opsSlow, () => {
        counter++;
        return evaluate("parallelPlateCapacitance", { area: `${1 + counter * 1e-9} cm^2`, gap: `${0.1 + counter * 1e-9} mm`, relativePermittivity: 4.4 }).value as number;
      }),
      mathjsFresh: per(opsSlow, () => {
        counter++;
        return (math.evaluate(`8.8541878188e-12 F/m * 4.4 * (${1 + counter * 1e-9} cm^2) / (${0.1 + counter * 1e-9} mm)`) as math.Unit).toNumber("F");
      }),
    },
    opsSlow,
    7,
  );
  return [
    { name: "evaluate (unit strings, cached) vs mathjs parse+evaluate", value: times(t.ratio.mathjsEvaluate!), note: `emquant ${ns(t.ns.emquant!)}/call, mathjs.evaluate ${ns(t.ns.mathjsEvaluate!)} (times faster; target >= 20x)` },
    { name: "evaluate (unit strings, cached) vs mathjs compiled with Units", value: times(t.ratio.mathjsCompiled!), note: `mathjs compiled ${ns(t.ns.mathjsCompiled!)}/call (times faster)` },
    { name: "evaluate (fresh unit strings) vs mathjs parse+evaluate", value: times(fresh.ratio.mathjsFresh!), note: `emquant ${ns(fresh.ns.emquantFresh!)}/call uncached, mathjs ${ns(fresh.ns.mathjsFresh!)} (times faster)` },
  ];
}
