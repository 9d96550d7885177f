/**
 * `evaluate` with unit strings against mathjs evaluating the same formula with
 * units: parsing the whole expression each time, and a compiled expression
 * called with mathjs Unit arguments. Unit strings repeat in real requests
 * ("0.1 mm"), which emquant's parse cache serves; fresh strings are measured too,
 * and reading one string alone against mathjs's own Unit.parse of the same text.
 */
import * as math from "mathjs";
import { evaluate } from "../src/index.js";
import { parseQuantity } from "../src/units/parse.js";
import { type BenchRow, compare, ns, randomArray, times } from "./util.js";

// Units engineers write, each in a form mathjs's Unit.parse reads too (it does not read "5 1/s").
const UNITS = ["mm", "cm^2", "uF", "nH", "kV/mm", "A/m", "kg*m/s^2", "mT", "degC", "/s"];

/**
 * Reading one new unit string: emquant's parseQuantity (never a cache hit: every
 * string is new) and mathjs's Unit.parse (plus toSI, which any SI value needs) on
 * the same strings, and a repeated string from the cache. Strings are built
 * before timing; each timed run gets strings no run has seen.
 */
function readStrings(): BenchRow[] {
  const perRun = 2000;
  const runs = 5 + 11;
  let serial = 0;
  const pool = () => Array.from({ length: perRun }, (_, i) => `${(1 + ++serial * 1e-7).toPrecision(9)} ${UNITS[i % UNITS.length]}`);
  const pools = Array.from({ length: runs }, pool);
  const next: Record<string, number> = { emquant: 0, unitParse: 0, unitParseToSI: 0 };
  const over = (name: string, read: (s: string) => number) => () => {
    const strings = pools[next[name]!++ % runs]!;
    let s = 0;
    for (let i = 0; i < perRun; i++) s += read(strings[i]!);
    return s;
  };
  const fresh = compare(
    {
      emquant: over("emquant", (s) => parseQuantity(s).si),
      unitParse: over("unitParse", (s) => (math.Unit.parse(s) as unknown as { value: number }).value),
      unitParseToSI: over("unitParseToSI", (s) => math.Unit.parse(s).toSI().toNumber()),
    },
    perRun,
    11,
  );
  const repeated = pools[0]!.slice(0, 64);
  const cached = compare(
    {
      emquantCached: () => {
        let s = 0;
        for (let i = 0; i < 20_000; i++) s += parseQuantity(repeated[i & 63]!).si;
        return s;
      },
    },
    20_000,
    11,
  );
  return [
    {
      name: "fresh unit string: emquant read vs mathjs Unit.parse (same strings)",
      value: times(1 / fresh.ratio.unitParse!),
      note: `emquant ${ns(fresh.ns.emquant!)} per new string, Unit.parse ${ns(fresh.ns.unitParse!)}, Unit.parse + toSI ${ns(fresh.ns.unitParseToSI!)} (times Unit.parse's time; target <= 3x and <= 8 us); ${UNITS.join(", ")}`,
    },
    {
      name: "repeated unit string (cache hit)",
      value: ns(cached.ns.emquantCached!),
      note: `per read, ${(cached.ns.emquantCached! / fresh.ns.unitParse!).toFixed(3)}x a Unit.parse (target well under 1 us)`,
    },
  ];
}

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
    ...readStrings(),
    { name: "evaluate (unit strings, cached) vs mathjs parse+evaluate", value: times(t.ratio.mathjsEvaluate!), note: `emquant ${ns(t.ns.emquant!)}/call, mathjs.evaluate ${ns(t.ns.mathjsEvaluate!)} (times faster; target >= 20x)` },
    { name: "evaluate (unit strings, cached) vs mathjs compiled with Units", value: times(t.ratio.mathjsCompiled!), note: `mathjs compiled ${ns(t.ns.mathjsCompiled!)}/call (times faster)` },
    { name: "evaluate (fresh unit strings) vs mathjs parse+evaluate", value: times(fresh.ratio.mathjsFresh!), note: `emquant ${ns(fresh.ns.emquantFresh!)}/call uncached, mathjs ${ns(fresh.ns.mathjsFresh!)} (times faster)` },
  ];
}
