// A series input (coreLossForWaveform's waveform) on every path: the tools hold it as given and
// refuse to vary it, the CLI, notebook and HTTP read it, designs refuse it; each refusal is a coded
// error naming the input. The expected values are coreLossForWaveform's own (the physics is checked
// in waveform-loss.test.ts): these tests check that every path reaches the same number.
import { describe, expect, it } from "vitest";
import * as mathjs from "mathjs";
import { runCli } from "../../src/cli/run.js";
import { evaluate } from "../../src/core/evaluate.js";
import { compileDesign } from "../../src/designs/compile.js";
import { designSchema } from "../../src/designs/schema.js";
import { createHandler, openApiDocument, type HttpResponse } from "../../src/http/index.js";
import { createNotebookMath } from "../../src/notebook/index.js";
import { inputSchema } from "../../src/tools/catalog.js";
import { solveRequest } from "../../src/tools/solve.js";
import { sweepRequest } from "../../src/tools/sweep.js";
import { toleranceRequest } from "../../src/tools/tolerance.js";
import { WAVEFORM_MAX_SAMPLES } from "../../src/flux/waveform-loss.js";
import { expectFormulaError } from "../helpers/errors.js";

const ID = "coreLossForWaveform";
// An invented ferrite and a 0.2 T peak-to-peak triangle at 100 kHz (a scenario of our own).
const SCALARS = { coefficient: 1.5, frequencyExponent: 1.4, fluxExponent: 2.5, frequency: 100e3, volume: 5e-6 };
const WAVE = [0, 0.1, 0, -0.1];
const VALUE = evaluate(ID, { ...SCALARS, waveform: WAVE }).value as number;

describe("a series input through the tools", () => {
  it("solve finds a scalar input with the waveform held, and refuses to solve for the waveform", () => {
    const { frequency: _f, ...noFrequency } = SCALARS;
    const { volume: _v, ...noVolume } = SCALARS;
    const r = solveRequest({ formula: ID, solveFor: "frequency", target: VALUE, inputs: { ...noFrequency, waveform: WAVE } });
    expect(Math.abs(r.value / 100e3 - 1)).toBeLessThan(1e-9);
    const v = solveRequest({ formula: ID, solveFor: "volume", target: 2 * VALUE, inputs: { ...noVolume, waveform: WAVE } });
    expect(Math.abs(v.value / 10e-6 - 1)).toBeLessThan(1e-9);
    const e = expectFormulaError(() => solveRequest({ formula: ID, solveFor: "waveform", target: VALUE, inputs: SCALARS }));
    expect([e.code, e.input]).toEqual(["invalid_argument", "waveform"]);
    expect(e.message).toContain("a series input cannot be solved for");
  });

  it("sweep varies a scalar with the waveform fixed, point for point equal to evaluate, and refuses to sweep the waveform", () => {
    const { frequency: _f, ...fixed } = SCALARS;
    const s = sweepRequest({ formula: ID, vary: { frequency: { from: "10 kHz", to: "1 MHz", points: 5, scale: "log" } }, fixed: { ...fixed, waveform: WAVE } });
    const f = s.axes[0]!.values;
    for (let i = 0; i < f.length; i++) expect(s.output.values[i]).toBe(evaluate(ID, { ...SCALARS, frequency: f[i]!, waveform: WAVE }).value);
    const e = expectFormulaError(() => sweepRequest({ formula: ID, vary: { waveform: { from: 0, to: 1, points: 3 } }, fixed: SCALARS }));
    expect([e.code, e.input]).toEqual(["invalid_argument", "waveform"]);
  });

  it("tolerance holds the waveform at its samples and refuses a tolerance on it", () => {
    const r = toleranceRequest({ formula: ID, inputs: { ...SCALARS, volume: { nominal: 5e-6, percent: 10 }, waveform: WAVE }, options: { samples: 200 } });
    expect(r.nominal).toBe(VALUE);
    expect(r.worstCase.max / VALUE).toBeCloseTo(1.1, 12);
    const e = expectFormulaError(() => toleranceRequest({ formula: ID, inputs: { ...SCALARS, waveform: { nominal: WAVE, percent: 5 } as never } }));
    expect([e.code, e.input]).toEqual(["invalid_argument", "waveform"]);
  });
});

describe("a series input at the edges", () => {
  const cli = (...args: string[]): { status: number; out: string; err: string } => {
    let out = "";
    let err = "";
    const status = runCli(args, { out: (t) => (out += `${t}\n`), err: (t) => (err += `${t}\n`) });
    return { status, out, err };
  };
  const pairs = Object.entries(SCALARS).map(([k, v]) => `${k}=${v}`);

  it("the CLI reads a waveform as a bracketed list with a unit or as a plain comma list, and shows it as a series", () => {
    for (const w of ["waveform=[0, 100, 0, -100] mT", "waveform=0,0.1,0,-0.1", "waveform=[0 T, 100 mT, 0 T, -0.1 T]"]) {
      const r = cli("compute", ID, ...pairs, w, "--json");
      expect(r.status, r.err).toBe(0);
      expect(JSON.parse(r.out).value).toBe(VALUE);
    }
    const bad = cli("compute", ID, ...pairs, "waveform=0,0.1,x,-0.1", "--json");
    expect(bad.status).not.toBe(0);
    expect(bad.out + bad.err).toContain("sample 2");
    const show = cli("show", ID);
    expect(show.out).toContain(`FluxDensity [T], series of 2 to ${WAVEFORM_MAX_SAMPLES} samples`);
  });

  it("the notebook takes a mathjs matrix or array of quantities, and names a bad sample", () => {
    const math = createNotebookMath();
    const p = math.evaluate("coreLossForWaveform(1.5, 1.4, 2.5, 100 kHz, [0 T, 100 mT, 0 T, -0.1 T], 5 cm^3)") as mathjs.Unit;
    expect(p.toNumber("W")).toBe(VALUE);
    expect(() => math.evaluate("coreLossForWaveform(1.5, 1.4, 2.5, 100 kHz, [0 T, 1 m, 0 T], 5 cm^3)")).toThrow(/sample 1/);
  });

  it("the HTTP handler evaluates a JSON array and its OpenAPI schema bounds the array", () => {
    const handle = createHandler();
    const post = (body: unknown): HttpResponse => handle({ method: "POST", path: "/evaluate", body: JSON.stringify(body) });
    const ok = post({ formula: ID, inputs: { ...SCALARS, waveform: ["0 T", "100 mT", 0, -0.1] } });
    expect(ok.status).toBe(200);
    expect((ok.body as { value: number }).value).toBe(VALUE);
    const bad = post({ formula: ID, inputs: { ...SCALARS, waveform: [0, 0.1, "NaN T"] } });
    expect(bad.status).toBe(422);
    expect((bad.body as { error: { input: string } }).error.input).toBe("waveform");
    const schema = inputSchema(ID) as { properties: Record<string, Record<string, unknown>> };
    expect(schema.properties.waveform).toMatchObject({ type: "array", minItems: 2, maxItems: WAVEFORM_MAX_SAMPLES });
    expect(JSON.stringify(openApiDocument())).toContain(`"maxItems":${WAVEFORM_MAX_SAMPLES}`);
  });

  it("designs refuse a step with a series input, naming it, and their schema leaves such formulas out", () => {
    const e = expectFormulaError(() =>
      compileDesign({ inputs: {}, steps: { loss: { formula: ID, inputs: { ...SCALARS, waveform: WAVE as never } } } } as never),
    );
    expect([e.code, e.input]).toEqual(["invalid_argument", "waveform"]);
    expect(JSON.stringify(designSchema())).not.toContain(`"const":"${ID}"`);
  });
});
