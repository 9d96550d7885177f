import { spawn } from "node:child_process";
import { fileURLToPath } from "node:url";
import { describe, expect, it } from "vitest";
import { parseToleranceText, runCli } from "../../src/cli/run.js";
import { listFormulas } from "../../src/core/registry.js";
import type { InputSpec } from "../../src/core/spec.js";

const root = fileURLToPath(new URL("../..", import.meta.url));

/** Run the CLI in this process; returns the status and what it wrote. */
function cli(...args: string[]): { status: number; out: string; err: string } {
  let out = "";
  let err = "";
  const status = runCli(args, { out: (t) => (out += `${t}\n`), err: (t) => (err += `${t}\n`) });
  return { status, out, err };
}

/** Run the CLI as a process (node with the tsx loader on the source; no build needed). */
function spawnCli(...args: string[]): Promise<{ status: number | null; stdout: string; stderr: string }> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, ["--import", "tsx", "src/cli/main.ts", ...args], { cwd: root });
    let stdout = "";
    let stderr = "";
    child.stdout.setEncoding("utf8").on("data", (t: string) => (stdout += t));
    child.stderr.setEncoding("utf8").on("data", (t: string) => (stderr += t));
    child.on("error", reject);
    child.on("close", (status) => resolve({ status, stdout, stderr }));
  });
}

describe("the emquant command as a process", () => {
  it("computes with unit strings (exit 0, engineering prefix) and reports a bad input (exit 1, message on stderr)", async () => {
    // Both processes at once: starting node with the TypeScript loader takes seconds.
    const [ok, bad] = await Promise.all([
      spawnCli("compute", "parallelPlateCapacitance", "area=1 cm^2", "gap=0.1 mm"),
      spawnCli("compute", "parallelPlateCapacitance", "area=1 kg", "gap=0.1 mm"),
    ]);
    expect(ok.stderr).toBe("");
    expect(ok.status).toBe(0);
    expect(ok.stdout).toMatch(/^Capacitance = 8\.854 pF {3}\(8\.8541878188e-12 F\)/);
    expect(bad.status).toBe(1);
    expect(bad.stderr).toMatch(/error \[wrong_dimension\]: .*input "area" needs Area, got Mass/);
    expect(bad.stdout).toBe("");
  });
});

describe("the emquant command", () => {
  it("lists every registry formula, by category", () => {
    const r = cli("list");
    expect(r.status).toBe(0);
    for (const f of listFormulas()) expect(r.out).toContain(f.id);
    const cap = cli("list", "capacitance", "--json");
    const items = JSON.parse(cap.out) as { category: string }[];
    expect(items.length).toBeGreaterThan(0);
    expect(items.every((i) => i.category === "capacitance")).toBe(true);
    expect(cli("list", "nonsense").status).toBe(2);
  });

  it("shows each formula, and evaluates each formula's example from the shown inputs", () => {
    for (const f of listFormulas()) {
      const r = cli("show", f.id);
      expect(r.status, f.id).toBe(0);
      expect(r.out).toContain(f.definition.equation);
      for (const name of Object.keys(f.definition.inputs)) expect(r.out).toContain(`  ${name}: `);
      // The example inputs as SI numbers (vectors as "a, b, c").
      const pairs = Object.entries(f.definition.inputs as Record<string, InputSpec>)
        .filter(([, s]) => s.example !== undefined)
        .map(([n, s]) => `${n}=${Array.isArray(s.example) ? s.example.join(", ") : String(s.example)}`);
      const c = cli("compute", f.id, ...pairs, "--json");
      expect(c.status, `${f.id}: ${c.out}`).toBe(0);
      const json = JSON.parse(c.out);
      expect(json.id).toBe(f.id);
      expect(Array.isArray(json.warnings) && Array.isArray(json.cautions)).toBe(true);
    }
  });

  it("prints warnings and cautions in human output and in JSON", () => {
    const r = cli("compute", "parallelPlateCapacitance", "area=1 cm^2", "gap=2 mm");
    expect(r.out).toMatch(/warning \[fringing\]: gap is 20 % of the plate size/);
    const j = JSON.parse(cli("compute", "parallelPlateCapacitance", "area=1 cm^2", "gap=2 mm", "--json").out);
    expect(j.warnings[0].code).toBe("fringing");
    // Every caution a formula raises at its example reaches the human output.
    let seen = 0;
    for (const f of listFormulas()) {
      const pairs = Object.entries(f.definition.inputs as Record<string, InputSpec>)
        .filter(([, s]) => s.example !== undefined)
        .map(([n, s]) => `${n}=${Array.isArray(s.example) ? s.example.join(", ") : String(s.example)}`);
      const js = JSON.parse(cli("compute", f.id, ...pairs, "--json").out);
      const human = cli("compute", f.id, ...pairs).out;
      for (const c of js.cautions) {
        expect(human).toContain(`CAUTION [${c.code}]: ${c.message}`);
        seen++;
      }
    }
    expect(seen).toBeGreaterThan(0);
  });

  it("solves for an input, and says when there is no solution", () => {
    const r = cli("solve", "parallelPlateCapacitance", "gap", "target=100 pF", "area=1 cm^2");
    expect(r.status).toBe(0);
    expect(r.out).toMatch(/^gap = 8\.85419 um/);
    const j = JSON.parse(cli("solve", "parallelPlateCapacitance", "gap", "target=100 pF", "area=1 cm^2", "--json").out);
    expect(j.value).toBeCloseTo(8.8541878188e-6, 15);
    const n = cli("solve", "parallelPlateCapacitance", "relativePermittivity", "target=1 pF", "area=1 cm^2", "gap=0.1 mm");
    expect(n.status).toBe(1);
    expect(n.err).toMatch(/error \[no_solution\]/);
    const nj = cli("solve", "parallelPlateCapacitance", "relativePermittivity", "target=1 pF", "area=1 cm^2", "gap=0.1 mm", "--json");
    expect(JSON.parse(nj.out).error.code).toBe("no_solution");
    expect(cli("solve", "parallelPlateCapacitance", "gap", "area=1 cm^2").status).toBe(2);
  });

  it("runs a tolerance analysis from +-, percent and distribution texts", () => {
    const r = cli("tolerance", "parallelPlateCapacitance", "area=1 cm^2 +- 2%", "gap=0.1 mm +- 0.01 mm", "relativePermittivity=normal(4.4, 0.1)", "--samples", "2000", "--seed", "9");
    expect(r.status).toBe(0);
    expect(r.out).toMatch(/nominal {6}38\.96 pF/);
    expect(r.out).toMatch(/Monte Carlo {2}2000 of 2000 samples \(seed 9/);
    expect(r.out).toMatch(/share of variance:\n {2}gap/);
    const j = JSON.parse(cli("tolerance", "parallelPlateCapacitance", "area=1 cm^2 +- 2%", "gap=0.1 mm +- 0.01 mm", "--samples=500", "--json").out);
    expect(j.monteCarlo.samples).toBe(500);
    expect(j.worstCase.min).toBeLessThan(j.nominal);
    expect(parseToleranceText("0.2 mm ± 0.02 mm")).toEqual({ nominal: "0.2 mm", plusMinus: "0.02 mm" });
    expect(parseToleranceText("uniform(1 mm, 2 mm)")).toEqual({ distribution: "uniform", min: "1 mm", max: "2 mm" });
    expect(parseToleranceText("1e-3 +- 5 %")).toEqual({ nominal: "1e-3", percent: 5 });
  });

  it("sweeps to a table, CSV and a chart specification", () => {
    const t = cli("sweep", "parallelPlateCapacitance", "gap=0.1 mm..1 mm", "area=1 cm^2", "--points", "4", "--log");
    expect(t.status).toBe(0);
    expect(t.out.split("\n")[1]).toBe("100 um\t8.854 pF");
    expect(t.out).toMatch(/warning \[fringing\]/);
    const csv = cli("sweep", "parallelPlateCapacitance", "gap=0.1 mm..1 mm", "area=1 cm^2", "--points", "4", "--csv").out.trim().split("\n");
    expect(csv[0]).toBe("gap (m),parallelPlateCapacitance (F)");
    expect(csv).toHaveLength(5);
    const chart = JSON.parse(cli("sweep", "parallelPlateCapacitance", "gap=0.1 mm..1 mm", "area=1 cm^2", "--chart").out);
    expect(chart.data.values).toHaveLength(11);
  });

  it("keeps CSV and chart output data only and prints the grid's notes to stderr, with counts and the worst point", () => {
    // gap / sqrt(area) from 1 % to 20 % on 1 cm^2: fringing at every point above 1 % (common practice threshold).
    const csv = cli("sweep", "parallelPlateCapacitance", "gap=0.1 mm..2 mm", "area=1 cm^2", "--points", "5", "--csv");
    expect(csv.out.trim().split("\n")).toHaveLength(6);
    expect(csv.out).not.toMatch(/fringing/);
    expect(csv.err).toMatch(/^notes found on the grid:\nwarning \[fringing\]: .* \(at \d of 5 points; (worst|first) at gap = /);
    const chart = cli("sweep", "parallelPlateCapacitance", "gap=0.1 mm..2 mm", "area=1 cm^2", "--points", "5", "--chart");
    expect(() => JSON.parse(chart.out)).not.toThrow();
    expect(chart.err).toMatch(/warning \[fringing\]/);
    const table = cli("sweep", "parallelPlateCapacitance", "gap=0.1 mm..2 mm", "area=1 cm^2", "--points", "5");
    expect(table.out).toMatch(/notes found on the grid:\nwarning \[fringing\]: .* \(at \d of 5 points/);
  });

  it("includes the notes in sweep JSON and tolerance output", () => {
    const j = JSON.parse(cli("sweep", "parallelPlateCapacitance", "gap=0.1 mm..2 mm", "area=1 cm^2", "--points", "5", "--json").out);
    expect(j.notes[0]).toMatchObject({ code: "fringing", kind: "warning" });
    expect(j.notes[0].count).toBeGreaterThan(0);
    const t = cli("tolerance", "parallelPlateCapacitance", "area=1 cm^2", "gap=2 mm +- 50%", "--samples", "100");
    expect(t.out).toMatch(/warning \[fringing\]: .* \(at 120 of 120 points; (worst|first) at gap = /);
    const tj = JSON.parse(cli("tolerance", "parallelPlateCapacitance", "area=1 cm^2", "gap=2 mm +- 50%", "--samples", "100", "--json").out);
    expect(tj.notes[0]).toMatchObject({ code: "fringing", count: 120 });
  });

  it("prints no Infinity or NaN for a sweep across the whole double range", () => {
    for (const mode of [[], ["--csv"], ["--json"]]) {
      const r = cli("sweep", "parallelPlateCapacitance", "gap=-1.7e308..1.7e308", "area=1e300", "--points", "5", ...mode);
      expect(r.status).toBe(0);
      expect(r.out + r.err).not.toMatch(/Infinity|NaN/);
    }
  });

  it("answers usage errors with status 2 and help with status 0", () => {
    expect(cli().status).toBe(2);
    expect(cli("help").status).toBe(0);
    expect(cli("frobnicate").status).toBe(2);
    expect(cli("compute", "parallelPlateCapacitance", "--colour").status).toBe(2);
    const u = cli("compute", "noSuchFormula", "--json");
    expect(u.status).toBe(1);
    expect(JSON.parse(u.out).error.code).toBe("unknown_formula");
  });
});
