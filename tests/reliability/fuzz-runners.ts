/**
 * One runner per path of the fuzz suite: the cases it draws (fast-check
 * arbitraries, plain data) and how one case is run and judged. The tests
 * (fuzz-*.test.ts) and the hang diagnostic (fuzz-diagnose.ts) share them.
 */
import fc from "fast-check";
import { evaluate } from "../../src/core/evaluate.js";
import type { AnyFormula } from "../../src/core/formula.js";
import { solveDetails, solveRequest } from "../../src/tools/solve.js";
import { sweep, sweepRequest } from "../../src/tools/sweep.js";
import { evaluateColumns } from "../../src/tools/columns.js";
import { evaluateCsv } from "../../src/tools/columns-csv.js";
import { tolerance, toleranceRequest } from "../../src/tools/tolerance.js";
import { runCli } from "../../src/cli/run.js";
import {
  evaluateCase, exampleOf, perFormula, formulaById, hostileCount, hostileId, hostileNumber, IDS, inputsFor, inputValue,
  numericInputsFor, scalarNames, spanEnd, specsOf, targetName,
} from "./fuzz-cases.js";
import { FORBIDDEN, judge, type Verdict, withoutEchoes, userStrings, loopViolations } from "./fuzz-check.js";
import { resetLoopCount } from "../helpers/loop-count.js";
import { httpCase, runHttp } from "./fuzz-http.js";

export interface Runner<C> {
  readonly cases: fc.Arbitrary<C>;
  readonly run: (c: C) => Verdict | Promise<Verdict>;
}

/**
 * Formula evaluations a tool call may make, for its loop bound: solve samples at
 * most (300 decades + 6) * 100 per decade on each side plus its root polish;
 * tolerance at most 1e6 Monte Carlo samples plus 2^16 corners and the slopes;
 * a sweep at most 4e6 points, and the CLI's sweep re-evaluates up to 2000 of
 * them for their notes.
 */
export const EVALUATIONS = { solve: 100_000, tolerance: 1_100_000, sweep: 4_010_000, columns: 4_000_000 } as const;

/** The example output of a formula (a solve target to start from), or 1. */
const exampleOutput = new Map<string, number>();
function outputOf(f: AnyFormula): number {
  if (!exampleOutput.has(f.id)) {
    let v = 1;
    try {
      const r = evaluate(f.id, exampleOf(f)).value;
      if (typeof r === "number") v = r;
    } catch {
      // keep 1
    }
    exampleOutput.set(f.id, v);
  }
  return exampleOutput.get(f.id)!;
}

function without(x: unknown, name: unknown): unknown {
  if (typeof x !== "object" || x === null || Array.isArray(x) || typeof name !== "string") return x;
  const out = { ...(x as Record<string, unknown>) };
  delete out[name];
  return out;
}

// ---- evaluate and the typed calls ----

const evaluateRunner: Runner<{ id: unknown; inputs: unknown }> = {
  cases: evaluateCase,
  run: (c) => judge(() => evaluate(c.id as string, c.inputs as Record<string, unknown>), c),
};

type TypedCase = { id: string; inputs: unknown; details: boolean };
const typedRunner: Runner<TypedCase> = {
  cases: perFormula((f) =>
    fc.record({ id: fc.constant(f.id), inputs: fc.oneof(inputsFor(f), numericInputsFor(f)), details: fc.boolean() })),
  run: (c) => {
    const f = formulaById(c.id)!;
    return judge(() => (c.details ? f.details(c.inputs as never) : f(c.inputs as never)), c);
  },
};

// ---- solve ----

const solveOptions = fc.oneof(
  { weight: 6, arbitrary: fc.constant<unknown>(undefined) },
  { weight: 3, arbitrary: fc.record({ decades: hostileCount, samplesPerDecade: hostileCount }, { requiredKeys: [] }) },
  { weight: 1, arbitrary: fc.constantFrom<unknown>(null, {}, [], NaN, "fast", { range: null }, { range: [1] }, { range: "1..2" }) },
);

type SolveCase = { id: unknown; solveFor: unknown; target: unknown; inputs: unknown; options: unknown; typed: boolean };
const solveCases: fc.Arbitrary<SolveCase> = fc.oneof(
  {
    weight: 20,
    arbitrary: perFormula((f) =>
      fc.record({
        id: fc.constant<unknown>(f.id),
        solveFor: targetName(f),
        target: fc.oneof(
          fc.integer({ min: -40, max: 40 }).map((k) => outputOf(f) * 10 ** k),
          fc.integer({ min: -330, max: 330 }).map((k) => outputOf(f) * 10 ** k),
          hostileNumber,
          fc.constantFrom<unknown>("1 m", "", "NaN", null, {}, [1, 2, 3], "1e400 F"),
        ),
        inputs: inputsFor(f),
        options: fc.oneof(
          { weight: 4, arbitrary: solveOptions },
          { weight: 1, arbitrary: fc.tuple(spanEnd(f, scalarNames(f)[0] ?? specsOf(f)[0]![0]), spanEnd(f, scalarNames(f)[0] ?? specsOf(f)[0]![0])).map((range) => ({ range }) as unknown) },
        ),
        typed: fc.boolean(),
      })),
  },
  { weight: 1, arbitrary: fc.record({ id: hostileId, solveFor: fc.constant<unknown>("gap"), target: fc.constant<unknown>(1), inputs: fc.constant<unknown>({}), options: solveOptions, typed: fc.constant(false) }) },
);

const solveRunner: Runner<SolveCase> = {
  cases: solveCases,
  run: (c) =>
    judge(() => {
      const inputs = without(c.inputs, c.solveFor);
      if (c.typed && typeof c.id === "string") {
        const given = typeof inputs === "object" && inputs !== null ? { ...(inputs as object), target: c.target } : inputs;
        return solveDetails(formulaById(c.id)! as never, c.solveFor as never, given as never, c.options as never);
      }
      return solveRequest({ formula: c.id, solveFor: c.solveFor, target: c.target, inputs, options: c.options } as never);
    }, c, EVALUATIONS.solve),
};

// ---- tolerance ----

function toleranceValue(f: AnyFormula, name: string): fc.Arbitrary<unknown> {
  const v = inputValue(f, name);
  return fc.oneof(
    { weight: 2, arbitrary: v },
    { weight: 2, arbitrary: fc.record({ nominal: v, plusMinus: v }) },
    { weight: 2, arbitrary: fc.record({ nominal: v, percent: fc.oneof(hostileNumber, fc.constantFrom(1, 5, 50, 100, 200)) }) },
    { weight: 1, arbitrary: fc.record({ distribution: fc.constantFrom<unknown>("normal", "Normal", "cauchy", null), mean: v, sd: v }) },
    { weight: 1, arbitrary: fc.record({ distribution: fc.constant<unknown>("uniform"), min: v, max: v }) },
    { weight: 1, arbitrary: fc.constantFrom<unknown>({}, { nominal: 1 }, { percent: 5 }, { nominal: {}, percent: 5 }, { nominal: 1, plusMinus: 1, percent: 1 }) },
  );
}

/** Monte Carlo sample counts: small legal ones mostly (a case stays cheap), and hostile ones. */
const samples = fc.oneof({ weight: 4, arbitrary: fc.integer({ min: 0, max: 64 }) }, { weight: 1, arbitrary: hostileCount });

type ToleranceCase = { id: unknown; inputs: unknown; options: unknown; typed: boolean };
const toleranceCases: fc.Arbitrary<ToleranceCase> = fc.oneof(
  {
    weight: 20,
    arbitrary: perFormula((f) => {
      const names = specsOf(f).map(([n]) => n);
      return fc.record({
        id: fc.constant<unknown>(f.id),
        inputs: fc.oneof(
          { weight: 8, arbitrary: fc.tuple(...names.map((n) => toleranceValue(f, n)), fc.subarray(names, { maxLength: 1 })).map((vs) => {
            const removed = vs.pop() as string[];
            const x: Record<string, unknown> = {};
            names.forEach((n, i) => {
              if (!removed.includes(n)) x[n] = vs[i];
            });
            return x as unknown;
          }) },
          { weight: 1, arbitrary: inputsFor(f) },
        ),
        options: fc.oneof(
          { weight: 8, arbitrary: fc.record({ samples, seed: fc.oneof(fc.integer(), hostileCount), maxCornerInputs: hostileCount }, { requiredKeys: ["samples"] }) },
          { weight: 1, arbitrary: fc.constantFrom<unknown>(null, [], NaN, { samples: {} }, { samples: "5" }, { samples: 1e300 }, { samples: -1 }, { samples: NaN }) },
        ),
        typed: fc.boolean(),
      });
    }),
  },
  { weight: 1, arbitrary: fc.record({ id: hostileId, inputs: fc.constant<unknown>({}), options: fc.constant<unknown>({ samples: 0 }), typed: fc.constant(false) }) },
);

const toleranceRunner: Runner<ToleranceCase> = {
  cases: toleranceCases,
  run: (c) =>
    judge(() => (c.typed && typeof c.id === "string"
      ? tolerance(formulaById(c.id)! as never, c.inputs as never, c.options as never)
      : toleranceRequest({ formula: c.id, inputs: c.inputs, options: c.options } as never)), c, EVALUATIONS.tolerance),
};

// ---- sweep ----

function axis(f: AnyFormula, name: string): fc.Arbitrary<unknown> {
  return fc.oneof(
    { weight: 8, arbitrary: fc.record({
      from: spanEnd(f, name),
      to: spanEnd(f, name),
      points: fc.oneof({ weight: 4, arbitrary: fc.integer({ min: 1, max: 24 }) }, { weight: 1, arbitrary: hostileCount }),
      scale: fc.constantFrom<unknown>("linear", "log", "log", "Log", "exp", 1),
    }, { requiredKeys: ["from", "to", "points"] }) },
    { weight: 1, arbitrary: fc.constantFrom<unknown>(null, {}, [], 5, "1..2", { from: 1, to: 2 }, { from: 1, to: 2, points: 3, scale: null }) },
  );
}

type SweepCase = { id: unknown; vary: unknown; fixed: unknown; typed: boolean };
const sweepCases: fc.Arbitrary<SweepCase> = fc.oneof(
  {
    weight: 20,
    arbitrary: perFormula((f) =>
      fc.record({
        id: fc.constant<unknown>(f.id),
        vary: fc.oneof(
          { weight: 8, arbitrary: fc.uniqueArray(targetName(f), { minLength: 1, maxLength: 2 }).chain((names) =>
            fc.tuple(...names.map((n) => axis(f, String(n)))).map((axes) => {
              const v: Record<string, unknown> = {};
              names.forEach((n, i) => Object.defineProperty(v, String(n), { value: axes[i], enumerable: true, configurable: true, writable: true }));
              return v as unknown;
            })) },
          { weight: 1, arbitrary: fc.constantFrom<unknown>(null, {}, [], "gap", { a: 1, b: 2, c: 3 }) },
        ),
        fixed: inputsFor(f),
        typed: fc.boolean(),
      })),
  },
  { weight: 1, arbitrary: fc.record({ id: hostileId, vary: fc.constant<unknown>({ gap: { from: 1, to: 2, points: 2 } }), fixed: fc.constant<unknown>({}), typed: fc.constant(false) }) },
);

/** NaN marks a point not computed in a sweep's output arrays (documented), nowhere else. */
function sweepNaN(result: unknown): (path: string, index: number) => boolean {
  const computed = (result as { computed?: Uint8Array } | undefined)?.computed;
  return (path, index) => computed !== undefined && path.startsWith("result.output.") && computed[index] === 0;
}

const sweepRunner: Runner<SweepCase> = {
  cases: sweepCases,
  run: (c) => {
    const vary = c.vary;
    const fixed = typeof vary === "object" && vary !== null ? Object.keys(vary).reduce((x, n) => without(x, n), c.fixed) : c.fixed;
    return judge(() => (c.typed && typeof c.id === "string"
      ? sweep(formulaById(c.id)! as never, { vary, fixed } as never)
      : sweepRequest({ formula: c.id, vary, fixed } as never)), c, EVALUATIONS.sweep, sweepNaN);
  },
};

// ---- columns ----

type ColumnsCase = { id: unknown; inputs: unknown; csv: boolean };
const columnsCases: fc.Arbitrary<ColumnsCase> = fc.oneof(
  {
    weight: 20,
    arbitrary: perFormula((f) =>
      fc.record({
        id: fc.constant<unknown>(f.id),
        fixed: inputsFor(f),
        // Columns of hostile values (or hostile things in place of a column), 1-8 rows.
        columns: fc.uniqueArray(targetName(f), { minLength: 1, maxLength: 3 }).chain((names) =>
          fc.integer({ min: 1, max: 8 }).chain((rows) =>
            fc.tuple(...names.map((n) => fc.oneof(
              { weight: 6, arbitrary: fc.array(Object.hasOwn(f.definition.inputs, String(n)) ? inputValue(f, String(n)) : hostileNumber, { minLength: rows, maxLength: rows }) },
              { weight: 1, arbitrary: fc.array(hostileNumber, { minLength: rows, maxLength: rows }).map((a) => new Float64Array(a)) },
              { weight: 1, arbitrary: fc.record({ values: fc.array(hostileNumber, { minLength: rows, maxLength: rows + 1 }), unit: fc.constantFrom<unknown>("mm", "kg", "", "degC", null, "1/in") }) },
              { weight: 1, arbitrary: fc.constantFrom<unknown>([], null, {}, [[1, 2, 3]], new Float64Array(0)) },
            ))).map((cols) => Object.fromEntries(names.map((n, i) => [String(n), cols[i]])))),
        ),
        csv: fc.boolean(),
      }).map(({ id, fixed, columns, csv }) => ({ id, inputs: typeof fixed === "object" && fixed !== null ? { ...(fixed as object), ...columns } : columns, csv }))),
  },
  { weight: 1, arbitrary: fc.record({ id: hostileId, inputs: fc.constant<unknown>({ gap: [1, 2] }), csv: fc.constant(false) }) },
);

/** CSV text of a case's column inputs (cells as text), the other inputs fixed. */
function asCsv(inputs: Record<string, unknown>): { text: string; fixed: Record<string, unknown> } {
  const cols = Object.entries(inputs).filter(([, v]) => Array.isArray(v) && !v.some((c) => typeof c === "object" && c !== null));
  const fixed = Object.fromEntries(Object.entries(inputs).filter(([k]) => !cols.some(([c]) => c === k)));
  const rows = Math.max(1, ...cols.map(([, v]) => (v as unknown[]).length));
  const cell = (v: unknown): string => `"${argText(v).replace(/"/g, '""')}"`;
  const lines = [cols.map(([k]) => k).join(","), ...Array.from({ length: rows }, (_, i) => cols.map(([, v]) => cell((v as unknown[])[i] ?? "")).join(","))];
  return { text: `${lines.join("\n")}\n`, fixed };
}

/** NaN marks a row that failed in a columns result's value arrays (documented), nowhere else. */
function columnsNaN(result: unknown): (path: string, index: number) => boolean {
  const errors = (result as { errors?: Uint8Array } | undefined)?.errors;
  return (path, index) => errors !== undefined && path.startsWith("result.output.") && errors[index] !== 0;
}

const columnsRunner: Runner<ColumnsCase> = {
  cases: columnsCases,
  run: (c) => judge(() => {
    if (c.csv && typeof c.inputs === "object" && c.inputs !== null && typeof c.id === "string") {
      const { text, fixed } = asCsv(c.inputs as Record<string, unknown>);
      return evaluateCsv(c.id, text, fixed);
    }
    return evaluateColumns(c.id as string, c.inputs as never);
  }, c, EVALUATIONS.columns, columnsNaN),
};

// ---- the command line, in process ----

function argText(v: unknown): string {
  if (typeof v === "string") return v;
  if (Array.isArray(v)) return v.map(argText).join(", ");
  try {
    return String(v);
  } catch {
    return "[object]"; // Object.create(null) has no toString
  }
}

const FLAG = fc.oneof(
  fc.constantFrom("--json", "--log", "--csv", "--chart", "--help", "-h", "--", "--bogus", "--json=1", "--samples", "--points", "--seed", "--range", "=", "x=", "=5"),
  fc.tuple(fc.constantFrom("--samples", "--points", "--seed"), fc.constantFrom("NaN", "-1", "0", "1", "3", "1e300", "Infinity", "abc", "", "2.5", "-0", "0x10", "1e7")).map(([f, v]) => `${f}=${v}`),
  fc.tuple(fc.constantFrom("--range"), fc.constantFrom("1 mm..10 mm", "..", "1..", "..1", "NaN..1", "-1e308..1e308", "1e400..1", "a..b", "10..1", "0 V..1 kV")).map(([f, v]) => `${f}=${v}`),
);

function cliPairs(f: AnyFormula): fc.Arbitrary<string[]> {
  const names = specsOf(f).map(([n]) => n);
  return fc.tuple(...names.map((n) => fc.option(inputValue(f, n), { freq: 2 }))).map((vs) => {
    const ex = exampleOf(f);
    return names.map((n, i) => `${n}=${argText(vs[i] === null ? ex[n] : vs[i])}`);
  });
}

const cliCases: fc.Arbitrary<string[]> = fc.oneof(
  {
    weight: 12,
    arbitrary: perFormula((f) =>
      fc.tuple(
        fc.constantFrom("compute", "compute", "solve", "tolerance", "sweep", "show"),
        cliPairs(f),
        fc.constantFrom(...scalarNames(f), "bogus", "__proto__"),
        fc.array(FLAG, { maxLength: 3 }),
        fc.constantFrom("1", "1 pF", "NaN", "1e400", "", "1e-300", "-5"),
        fc.constantFrom("1e-3..1", "0..0", "-1e308..1e308", "1e-300..1e300", "a..b", "1 mm..1 kg", ".."),
      ).map(([cmd, pairs, name, flags, target, span]) => {
        const argv = [cmd, f.id];
        if (cmd === "solve") argv.push(name, `target=${target}`);
        let ps = pairs;
        if (cmd === "solve") ps = pairs.filter((p) => !p.startsWith(`${name}=`));
        if (cmd === "sweep") ps = pairs.map((p) => (p.startsWith(`${name}=`) ? `${name}=${span}` : p));
        argv.push(...ps, ...flags);
        // A tolerance run is a Monte Carlo of 10000 samples by default: keep most cases small.
        if (cmd === "tolerance" && !flags.some((a) => a.startsWith("--samples"))) argv.push("--samples=16");
        if (cmd === "sweep" && !flags.some((a) => a.startsWith("--points"))) argv.push("--points=5");
        return argv;
      })),
  },
  { weight: 2, arbitrary: fc.array(fc.oneof(FLAG, fc.constantFrom("list", "show", "help", "compute", "solve", "sweep", "tolerance", "capacitance", "nonsense", ...IDS.slice(0, 5), "__proto__", "constructor", "a=1", "area=1 cm^2", ""), fc.string({ maxLength: 8 })), { maxLength: 5 }) },
);

/** The CLI's verdict: exit 0 with clean output, or non-zero with a one-line message; never a throw or a stack trace. */
function runCliCase(argv: string[]): Verdict {
  let out = "";
  let err = "";
  const strings = userStrings(argv);
  for (const a of argv) for (const part of a.split(/=|\.\.|,/)) strings.add(part.trim());
  resetLoopCount();
  let status: number;
  const v: string[] = [];
  try {
    status = runCli(argv, { out: (t) => (out += `${t}\n`), err: (t) => (err += `${t}\n`) });
  } catch (e) {
    return { violations: [`runCli threw ${(e as Error)?.constructor?.name}: ${String((e as Error)?.message ?? e).slice(0, 160)}`] };
  }
  const cmd = argv.find((a) => !a.startsWith("-"));
  const evaluations = cmd === "sweep" ? EVALUATIONS.sweep : cmd === "tolerance" ? EVALUATIONS.tolerance : cmd === "solve" ? EVALUATIONS.solve : 1;
  v.push(...loopViolations(evaluations));
  const text = withoutEchoes(`${out}${err}`, strings);
  // Unquoted echoes of the user's words ("unknown option --NaN") are the user's text, too.
  let clean = text;
  for (const s of strings) if (s && FORBIDDEN.test(s)) clean = clean.split(s).join("…");
  if (FORBIDDEN.test(clean)) v.push(`output says ${JSON.stringify(clean.match(new RegExp(`.{0,60}(${FORBIDDEN.source}).{0,60}`))?.[0])}`);
  if (/^\s+at .+\(.*:\d+:\d+\)$/m.test(out + err)) v.push("printed a stack trace");
  if (status !== 0) {
    if (out === "" && err === "") v.push(`exit ${status} with no message`);
    const first = (err || out).split("\n")[0]!;
    if (err && !/^(error \[[a-z_]+\]|usage): \S/.test(first)) v.push(`error line is not a one-line message: ${JSON.stringify(first.slice(0, 120))}`);
  }
  return { violations: v, code: String(status) };
}

const cliRunner: Runner<string[]> = { cases: cliCases, run: runCliCase };

// ---- the HTTP example, in process ----

const httpRunner: Runner<Parameters<typeof runHttp>[0]> = {
  cases: httpCase({ evaluate: evaluateCase, solve: solveCases, tolerance: toleranceCases, sweep: sweepCases, columns: columnsCases }),
  run: runHttp,
};

/**
 * Cases per path, from the fixed seed: 104,000 in all (the issue asks for at
 * least 1e5). Cheap paths get many; the design tools, whose one call is up to
 * a few hundred evaluations, fewer.
 */
export const CASES = {
  evaluate: 40_000,
  typed: 40_000,
  solve: 2_000,
  tolerance: 4_000,
  sweep: 6_000,
  columns: 2_000,
  cli: 6_000,
  http: 4_000,
} as const;

export const RUNNERS = {
  evaluate: evaluateRunner,
  typed: typedRunner,
  solve: solveRunner,
  tolerance: toleranceRunner,
  sweep: sweepRunner,
  columns: columnsRunner,
  cli: cliRunner,
  http: httpRunner,
} as const;

export type RunnerKind = keyof typeof RUNNERS;
