import { spawn } from "node:child_process";
import { readFileSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { describe, expect, it } from "vitest";
import { parseToleranceText, runCli } from "../../src/cli/run.js";
import { cliCommand, spawnCli } from "../helpers/spawn-cli.js";
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

/** Split a command line as a POSIX shell does for the lines the CLI prints (words, "double quotes"). */
function shellWords(line: string): string[] {
  return [...line.matchAll(/(?:[^\s"]+|"[^"]*")+/g)].map((m) => m[0].replace(/"/g, ""));
}

/** The "Try:" line `show` prints for a formula, without "Try: ". */
function tryLine(id: string): string {
  const line = cli("show", id).out.split("\n").find((l) => l.startsWith("Try: "));
  expect(line, `${id} shows a Try line`).toBeDefined();
  return line!.slice("Try: ".length);
}

describe("the emquant command as a process", () => {
  it("computes with unit strings (exit 0, engineering prefix) and reports a bad input (exit 1, message on stderr)", async () => {
    // A Try line with vectors, run by a real shell exactly as printed (emquant -> this run's bundle of the CLI).
    const vectorTry = tryLine("lorentzForce").replace(/^emquant /, "");
    const [node, program] = cliCommand();
    // All processes at once.
    const [ok, bad, shell] = await Promise.all([
      spawnCli("compute", "parallelPlateCapacitance", "area=1 cm^2", "gap=0.1 mm"),
      spawnCli("compute", "parallelPlateCapacitance", "area=1 kg", "gap=0.1 mm"),
      new Promise<{ status: number | null; stdout: string }>((resolve, reject) => {
        const child = spawn("sh", ["-c", `"${node}" "${program}" ${vectorTry}`], { cwd: root });
        let stdout = "";
        child.stdout.setEncoding("utf8").on("data", (t: string) => (stdout += t));
        child.on("error", reject);
        child.on("close", (status) => resolve({ status, stdout }));
      }),
    ]);
    expect(shell.status, vectorTry).toBe(0);
    expect(shell.stdout).toMatch(/x = -320\.4 aN/); // q v B = -1.602176634e-19 C x 1e5 m/s x 0.01 T in -x, plus q E = -1.6e-16 N
    expect(ok.stderr).toBe("");
    expect(ok.status).toBe(0);
    expect(ok.stdout).toMatch(/^Capacitance = 8\.854 pF {3}\(8\.8541878188e-12 F\)/);
    expect(bad.status).toBe(1);
    expect(bad.stderr).toMatch(/error \[wrong_dimension\]: .*input "area" needs Area, got Mass/);
    expect(bad.stdout).toBe("");
  }, 240_000); // three node processes, on a shared machine
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

  it("runs every formula's Try line exactly as show prints it", () => {
    for (const f of listFormulas()) {
      const argv = shellWords(tryLine(f.id));
      expect(argv[0]).toBe("emquant");
      const r = cli(...argv.slice(1));
      expect(r.status, `${argv.join(" ")}\n${r.err}`).toBe(0);
      // Every input with an example is on the line, so the line gives the example's value.
      const example = cli("compute", f.id, ...Object.entries(f.definition.inputs as Record<string, InputSpec>)
        .filter(([, s]) => s.example !== undefined)
        .map(([n, s]) => `${n}=${Array.isArray(s.example) ? s.example.join(", ") : String(s.example)}`), "--json");
      const fromTry = cli(...argv.slice(1), "--json");
      expect(JSON.parse(fromTry.out).value, f.id).toEqual(JSON.parse(example.out).value);
    }
  });

  it("reads vectors in the form show prints them, with one unit after the brackets or one per component", () => {
    const base = ["compute", "lorentzForce", "charge=1 C", "velocity=[0, 0, 0] m/s", "fluxDensity=[0, 0, 0] T", "--json"];
    const a = JSON.parse(cli(...base, "electricField=[1000, 0, 0] V/m").out);
    const b = JSON.parse(cli(...base, "electricField=[1 kV/m, 0 V/m, 0 V/m]").out);
    const c = JSON.parse(cli(...base, "electricField=1000, 0, 0").out);
    // F = q E with q = 1 C (Lorentz force law): 1000 N along x.
    for (const r of [a, b, c]) expect(r.value).toEqual([1000, 0, 0]);
    expect(cli("show", "lorentzForce").out).toContain('electricField="[1000, 0, 0] V/m"');
  });

  it("accepts the micro sign and Greek mu in units and prints results in engineering notation", () => {
    const mu = JSON.parse(cli("compute", "capacitorCharge", "capacitance=10 \u00b5F", "voltage=1 V", "--json").out);
    const greek = JSON.parse(cli("compute", "capacitorCharge", "capacitance=10 \u03bcF", "voltage=1 V", "--json").out);
    expect(mu.value).toBe(1e-5); // Q = C V = 10 uF x 1 V, the exact decimal 1e-5
    expect(greek.value).toBe(1e-5);
    const big = cli("compute", "loopField", "current=1 A", "radius=1 m", "radialDistance=1 m", "axialDistance=1e-200 m");
    expect(big.out).toMatch(/radial = 20e192 T/); // mu0 I / (2 pi z) = 2e193 T next to the wire
    expect(big.out).not.toMatch(/e\+/);
  });

  it("suggests close formula ids, commands and units, and names the unknown unit", () => {
    const id = cli("compute", "parallelPlateCapacitence", "area=1 cm^2");
    expect(id.status).toBe(1);
    expect(id.err).toContain('unknown formula "parallelPlateCapacitence" (did you mean "parallelPlateCapacitance"?)');
    const unit = cli("compute", "parallelPlateCapacitance", "area=1 cm^2", "gap=0.1 mmm");
    expect(unit.err).toContain('unknown unit "mmm"; did you mean "mm"?');
    const micro = cli("compute", "seriesCapacitance", "capacitance1=1 uf", "capacitance2=2 uF");
    expect(micro.err).toContain('unknown unit "uf"; did you mean "uF"?');
    const unknown = cli("compute", "parallelPlateCapacitance", "area=1 cm^2", "gap=0.1 furlongz");
    expect(unknown.err).toContain('unknown unit "furlongz"');
    expect(cli("shwo", "coaxialCapacitance").err).toContain('unknown command "shwo"; did you mean "show"?');
  });

  it("prints its version, the one in package.json", () => {
    const pkg = JSON.parse(readFileSync(new URL("../../package.json", import.meta.url), "utf8")) as { version: string };
    const r = cli("--version");
    expect(r.status).toBe(0);
    expect(r.out).toBe(`emquant ${pkg.version}\n`);
  });

  it("prints the usage once, to stderr, on a usage error (status 2), and to stdout for help (status 0)", () => {
    for (const args of [[], ["frobnicate"], ["compute", "parallelPlateCapacitance", "--colour"], ["solve", "parallelPlateCapacitance", "gap"]]) {
      const r = cli(...args);
      expect(r.status, args.join(" ")).toBe(2);
      expect(r.out).toBe("");
      expect(r.err.match(/^Usage:/gm), args.join(" ")).toHaveLength(1);
      expect(r.err).toMatch(/^usage: /);
    }
    const h = cli("help");
    expect(h.err).toBe("");
    expect(h.out.match(/^Usage:/gm)).toHaveLength(1);
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
