/**
 * emquant/http: what the HTTP layer costs over calling the library in
 * process, and how long the largest request the default limits allow takes,
 * as a multiple of one evaluation through the handler. The limits are what
 * bound a request's time (evaluation is synchronous), so these rows say what
 * a server at the defaults can be asked to do per request.
 *
 * The formula is coaxialCoilsMutualInductance (7 scalar inputs, elliptic
 * integrals per evaluation): among the costliest scalar formulas, and the one
 * with the most inputs to tolerance (2^7 corners).
 */
import { evaluate, getFormula } from "../src/index.js";
import { createHandler, DEFAULT_LIMITS } from "../src/http/index.js";
import { type BenchRow, compare, ns, times } from "./util.js";

const ID = "coaxialCoilsMutualInductance";

export async function run(): Promise<BenchRow[]> {
  const handle = createHandler();
  const specs = getFormula(ID).definition.inputs as Record<string, { example?: number; dimension?: string }>;
  const examples = Object.fromEntries(Object.entries(specs).map(([n, s]) => [n, s.example!]));
  const names = Object.keys(examples);
  const first = names.find((n) => specs[n]!.dimension === "Length")!;
  // The request bodies as a client sends them: JSON text.
  const text = (body: unknown): string => JSON.stringify(body);
  const evalBody = text({ formula: ID, inputs: examples });
  const call = (path: string, body: string): number => {
    const r = handle({ method: "POST", path, body });
    // The node adapter serialises the answer; count that too.
    return JSON.stringify(r.body).length + r.status;
  };
  const one = compare(
    {
      "evaluate()": () => {
        let s = 0;
        for (let i = 0; i < 200; i++) s += evaluate(ID, examples).value as number;
        return s;
      },
      "POST /evaluate": () => {
        let s = 0;
        for (let i = 0; i < 200; i++) s += call("/evaluate", evalBody);
        return s;
      },
    },
    200,
  );
  const base = one.ns["POST /evaluate"]!;
  const rows: BenchRow[] = [
    { name: "http: POST /evaluate vs evaluate() in process", value: times(one.ratio["POST /evaluate"]!), note: `${ns(base)} per request (${ID}, numbers in SI; body parsed, answer serialised)` },
  ];

  const fixed = Object.fromEntries(names.filter((n) => n !== first).map((n) => [n, examples[n]]));
  const ex = examples[first]!;
  const heavy: Record<string, string> = {
    [`sweep, ${DEFAULT_LIMITS.maxSweepPoints} points`]: text({ formula: ID, vary: { [first]: { from: ex / 2, to: ex * 2, points: DEFAULT_LIMITS.maxSweepPoints } }, fixed }),
    [`tolerance, ${DEFAULT_LIMITS.maxSamples} samples, ${names.length} inputs (all corners)`]: text({
      formula: ID,
      inputs: Object.fromEntries(names.map((n) => [n, { nominal: examples[n], percent: 1 }])),
      options: { samples: DEFAULT_LIMITS.maxSamples },
    }),
    // The row limit reached within the body limit: CSV text, one short cell per row (a length in mm, 3 digits).
    [`columns, ${DEFAULT_LIMITS.maxColumnRows} rows of CSV`]: text({
      formula: ID,
      csv: [`${first} (mm)`, ...Array.from({ length: DEFAULT_LIMITS.maxColumnRows }, (_, i) => (ex * 1000 * (0.5 + (i % 100) / 100)).toPrecision(3))].join("\n"),
      inputs: fixed,
    }),
    // An unreachable target: the search scans its whole grid before answering no_solution (422).
    [`solve, ${DEFAULT_LIMITS.maxSolveDecades} decades x ${DEFAULT_LIMITS.maxSolveSamplesPerDecade}/decade, no solution`]: text({
      formula: ID, solveFor: first, target: 1e300, inputs: fixed,
      options: { decades: DEFAULT_LIMITS.maxSolveDecades, samplesPerDecade: DEFAULT_LIMITS.maxSolveSamplesPerDecade },
    }),
  };
  for (const [name, body] of Object.entries(heavy)) {
    const path = name.startsWith("sweep") ? "/sweep" : name.startsWith("tolerance") ? "/tolerance" : name.startsWith("columns") ? "/columns" : "/solve";
    const status = handle({ method: "POST", path, body }).status;
    const c = compare(
      {
        one: () => {
          let s = 0;
          for (let i = 0; i < 200; i++) s += call("/evaluate", evalBody);
          return s;
        },
        heavy: () => call(path, body),
      },
      { one: 200, heavy: 1 },
      5,
      1,
    );
    rows.push({
      name: `http: largest default ${name}`,
      value: times(c.ratio.heavy!),
      note: `${(c.ns.heavy! / 1e6).toFixed(1)} ms per request (status ${status}), as a multiple of one POST /evaluate`,
    });
  }
  return rows;
}
