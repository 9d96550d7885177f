import { describe, expect, it } from "vitest";
import { parallelPlateCapacitance } from "../../src/capacitance/index.js";
import { FormulaError } from "../../src/core/errors.js";
import { evaluate } from "../../src/core/evaluate.js";
import { listFormulas } from "../../src/core/registry.js";
import type { InputSpec } from "../../src/core/spec.js";
import { sweep, sweepRequest, sweepToCsv, sweepToVegaLite } from "../../src/tools/sweep.js";

describe("sweeps of the parallel-plate capacitor", () => {
  it("equals individual evaluations along a log-spaced gap axis with exact ends", () => {
    const r = sweep(parallelPlateCapacitance, { vary: { gap: { from: 1e-4, to: 1e-2, points: 9, scale: "log" } }, fixed: { area: "1 cm^2", relativePermittivity: 4.4 } });
    expect(r.axes[0]!.values[0]).toBe(1e-4);
    expect(r.axes[0]!.values[8]).toBe(1e-2);
    expect(r.axes[0]!.values[4]).toBeCloseTo(1e-3, 15);
    for (let i = 0; i < 9; i++) {
      const single = parallelPlateCapacitance({ area: 1e-4 as never, gap: r.axes[0]!.values[i]! as never, relativePermittivity: 4.4 });
      expect(r.output.values[i]).toBe(single);
    }
    expect(r.notComputed).toBe(0);
    expect(r.output.unit).toBe("F");
  });

  it("fills a 2-D grid row-major and marks points outside the domain as not computed (NaN, mask 0)", () => {
    const r = sweepRequest({
      formula: "parallelPlateCapacitance",
      vary: { gap: { from: "0.1 mm", to: "1 mm", points: 4 }, relativePermittivity: { from: 0, to: 6, points: 4 } },
      fixed: { area: "1 cm^2" },
    });
    expect(r.output.values.length).toBe(16);
    // relativePermittivity 0 is below its domain (>= 1): column j = 0 is not computed.
    for (let i = 0; i < 4; i++) {
      expect(r.computed[i * 4]).toBe(0);
      expect(Number.isNaN(r.output.values[i * 4]!)).toBe(true);
      for (let j = 1; j < 4; j++) {
        const k = i * 4 + j;
        expect(r.computed[k]).toBe(1);
        expect(r.output.values[k]).toBe(evaluate("parallelPlateCapacitance", { area: 1e-4, gap: r.axes[0]!.values[i]!, relativePermittivity: r.axes[1]!.values[j]! }).value);
      }
    }
    expect(r.notComputed).toBe(4);
  });

  it("writes CSV with units in the header and empty cells where not computed", () => {
    const r = sweepRequest({
      formula: "parallelPlateCapacitance",
      vary: { relativePermittivity: { from: 0, to: 2, points: 3 } },
      fixed: { area: "1 cm^2", gap: "1 mm" },
    });
    const lines = sweepToCsv(r).trimEnd().split("\n");
    expect(lines[0]).toBe("relativePermittivity,parallelPlateCapacitance (F)");
    expect(lines).toHaveLength(4);
    expect(lines[1]).toBe("0,");
    expect(Number(lines[3]!.split(",")[1])).toBe(r.output.values[2]);
  });

  it("writes a Vega-Lite v5 line chart for one axis and a heatmap for two, leaving out points not computed", () => {
    const one = sweepToVegaLite(sweep(parallelPlateCapacitance, { vary: { gap: { from: 1e-4, to: 1e-3, points: 5, scale: "log" } }, fixed: { area: 1e-4 } })) as Record<string, any>;
    expect(one.$schema).toBe("https://vega.github.io/schema/vega-lite/v5.json");
    expect(one.mark.type).toBe("line");
    expect(one.data.values).toHaveLength(5);
    // The data stays in SI; the axes show engineering units chosen from it (0.1-1 mm; 0.885-8.85 pF).
    expect(one.data.values[0].gap).toBe(1e-4);
    expect(one.transform).toContainEqual({ calculate: 'datum["gap"] / 0.001', as: "gap shown" });
    expect(one.transform).toContainEqual({ calculate: 'datum["parallelPlateCapacitance"] / 1e-12', as: "parallelPlateCapacitance shown" });
    expect(one.encoding.x).toMatchObject({ field: "gap shown", type: "quantitative", title: "gap (mm)", scale: { type: "log" } });
    expect(one.encoding.y).toMatchObject({ field: "parallelPlateCapacitance shown", title: "parallelPlateCapacitance (pF)" });
    const two = sweepToVegaLite(sweepRequest({
      formula: "parallelPlateCapacitance",
      vary: { gap: { from: "0.1 mm", to: "1 mm", points: 3 }, relativePermittivity: { from: 0, to: 6, points: 3 } },
      fixed: { area: "1 cm^2" },
    })) as Record<string, any>;
    expect(two.mark).toBe("rect");
    expect(two.data.values).toHaveLength(6);
    expect(Object.keys(two.data.values[0]).sort()).toEqual(["gap", "parallelPlateCapacitance", "relativePermittivity"]);
    expect(two.encoding.color.field).toBe("parallelPlateCapacitance shown");
    expect(two.encoding.y.title).toBe("relativePermittivity");
    expect(JSON.parse(JSON.stringify(two))).toEqual(two);
  });

  it("checks the fixed inputs once, with the input's name, and refuses bad axes", () => {
    const code = (fn: () => unknown): [string, string | undefined] => {
      try {
        fn();
      } catch (e) {
        if (e instanceof FormulaError) return [e.code, e.input];
        throw e;
      }
      return ["none", undefined];
    };
    expect(code(() => sweepRequest({ formula: "parallelPlateCapacitance", vary: { gap: { from: 1e-4, to: 1e-3, points: 3 } }, fixed: { area: "-1 cm^2" } }))).toEqual(["out_of_domain", "area"]);
    expect(code(() => sweepRequest({ formula: "parallelPlateCapacitance", vary: { gap: { from: 1e-4, to: 1e-3, points: 3 } }, fixed: {} }))).toEqual(["missing_input", "area"]);
    expect(code(() => sweepRequest({ formula: "parallelPlateCapacitance", vary: { gap: { from: "1 kg", to: 1e-3, points: 3 } }, fixed: { area: 1e-4 } }))).toEqual(["wrong_dimension", "gap"]);
    expect(code(() => sweepRequest({ formula: "parallelPlateCapacitance", vary: { gap: { from: 1e-4, to: 1e-3, points: 0 } }, fixed: { area: 1e-4 } }))).toEqual(["invalid_argument", "gap"]);
    expect(code(() => sweepRequest({ formula: "parallelPlateCapacitance", vary: { gap: { from: -1, to: 1, points: 3, scale: "log" } }, fixed: { area: 1e-4 } }))).toEqual(["invalid_argument", "gap"]);
    expect(code(() => sweepRequest({ formula: "parallelPlateCapacitance", vary: {}, fixed: { area: 1e-4 } }))[0]).toBe("invalid_argument");
  });
});

describe("sweeps of every registry formula", () => {
  it("equal individual evaluations at every computed point, and evaluate refuses every point not computed", () => {
    let checked = 0;
    for (const f of listFormulas()) {
      const specs = f.definition.inputs as Record<string, InputSpec>;
      const ex: Record<string, unknown> = {};
      for (const [n, s] of Object.entries(specs)) if (s.example !== undefined) ex[n] = s.example;
      for (const [n, s] of Object.entries(specs)) {
        if ("choices" in s || s.vector || typeof s.example !== "number") continue;
        const { [n]: _omit, ...fixed } = ex;
        const e = s.example;
        const from = e === 0 ? -1 : e * 0.5;
        const to = e === 0 ? 1 : e * 2;
        const r = sweep(f as never, { vary: { [n]: { from, to, points: 7 } }, fixed } as never);
        for (let i = 0; i < 7; i++) {
          const v = r.axes[0]!.values[i]!;
          let single: number | readonly number[] | undefined;
          try {
            single = evaluate(f.id, { ...fixed, [n]: v }).value;
          } catch (err) {
            expect(err).toBeInstanceOf(FormulaError);
          }
          const label = `${f.id} ${n} = ${v}`;
          expect(r.computed[i], label).toBe(single === undefined ? 0 : 1);
          if (single === undefined) continue;
          if (typeof single === "number") expect(r.output.values[i], label).toBe(single);
          else {
            const comps = f.definition.output.components as readonly string[];
            comps.forEach((c, k) => expect(r.output.components![c]![i], label).toBe((single as readonly number[])[k]));
          }
          checked++;
        }
      }
    }
    expect(checked).toBeGreaterThan(0);
  });

  it("equal individual evaluations over two-axis grids that cross domain bounds and relations", () => {
    let checked = 0;
    let refused = 0;
    for (const f of listFormulas()) {
      const specs = f.definition.inputs as Record<string, InputSpec>;
      const ex: Record<string, unknown> = {};
      for (const [n, s] of Object.entries(specs)) if (s.example !== undefined) ex[n] = s.example;
      const swept = Object.entries(specs).filter(([, s]) => !("choices" in s) && !s.vector && typeof s.example === "number").map(([n]) => n);
      if (swept.length < 2) continue;
      const [a, b] = swept as [string, string];
      const { [a]: _a, [b]: _b, ...fixed } = ex;
      // From below zero to past twice the example: crosses lower bounds, and the
      // relations between the two inputs somewhere in the grid.
      const axis = (n: string) => {
        const e = ex[n] as number;
        return e === 0 ? { from: -1, to: 1, points: 5 } : { from: -0.5 * e, to: 2.5 * e, points: 7 };
      };
      const r = sweep(f as never, { vary: { [a]: axis(a), [b]: axis(b) }, fixed } as never);
      const n1 = r.axes[1]!.values.length;
      for (let k = 0; k < r.computed.length; k++) {
        const va = r.axes[0]!.values[Math.floor(k / n1)]!;
        const vb = r.axes[1]!.values[k % n1]!;
        let single: number | readonly number[] | undefined;
        try {
          single = evaluate(f.id, { ...fixed, [a]: va, [b]: vb }).value;
        } catch (err) {
          expect(err).toBeInstanceOf(FormulaError);
        }
        const label = `${f.id} ${a} = ${va}, ${b} = ${vb}`;
        expect(r.computed[k], label).toBe(single === undefined ? 0 : 1);
        if (single === undefined) {
          expect(Number.isNaN(r.output.values[k]), label).toBe(true);
          for (const c of Object.values(r.output.components ?? {})) expect(Number.isNaN(c[k]), label).toBe(true);
          refused++;
        } else {
          expect(r.output.values[k], label).toBe(typeof single === "number" ? single : single[0]);
          if (typeof single !== "number") {
            const comps = f.definition.output.components as readonly string[];
            comps.forEach((c, m) => expect(r.output.components![c]![k], label).toBe((single as readonly number[])[m]));
          }
          checked++;
        }
      }
    }
    expect(checked).toBeGreaterThan(1000);
    expect(refused).toBeGreaterThan(100);
  });

  it("returns every array as a view into one buffer", () => {
    const r = sweep(parallelPlateCapacitance, { vary: { gap: { from: 1e-4, to: 1e-3, points: 3 }, area: { from: 1e-4, to: 1e-3, points: 2 } } });
    expect(r.computed.buffer).toBe(r.output.values.buffer);
    expect(r.axes[0]!.values.buffer).toBe(r.output.values.buffer);
    expect([...r.axes[1]!.values]).toEqual([1e-4, 1e-3]);
    expect(r.output.values.length).toBe(6);
    expect(r.computed.length).toBe(6);
  });
});
