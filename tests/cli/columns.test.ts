// `emquant columns`: every row of a CSV file, run in process with the files
// from a map (main.ts passes node:fs, as for `design`).
import { describe, expect, it } from "vitest";
import { runCli } from "../../src/cli/run.js";
import { evaluate } from "../../src/core/evaluate.js";

const FILES: Record<string, string> = {
  "parts.csv": "area (cm^2),gap (mm)\n1,0.1\n1,-1\n2,5\n",
  "good.csv": "gap\n0.1 mm\n200 um\n",
};

function cli(...args: string[]): { status: number; out: string; err: string } {
  let out = "";
  let err = "";
  const files = {
    readText: (p: string): string => {
      if (!Object.hasOwn(FILES, p)) throw new Error(`no such file ${p}`);
      return FILES[p]!;
    },
    writeText: (): void => {},
  };
  const status = runCli(args, { out: (t) => (out += `${t}\n`), err: (t) => (err += `${t}\n`), files });
  return { status, out, err };
}

describe("emquant columns", () => {
  it("prints every row, the failed rows' codes and messages, and the notes; exit status 4 when a row fails", () => {
    const r = cli("columns", "parallelPlateCapacitance", "parts.csv", "relativePermittivity=4.4");
    expect(r.status).toBe(4);
    const lines = r.out.split("\n");
    expect(lines[0]).toBe("row\tparallelPlateCapacitance\terror");
    expect(lines[2]).toBe("2\tnot computed\tout_of_domain");
    expect(r.out).toContain("2 of 3 rows computed");
    expect(r.out).toContain('error [out_of_domain] in 1 of 3 rows; first at row 2: parallelPlateCapacitance: input "gap" must be > 0');
    expect(r.out).toMatch(/warning \[fringing\].*\(at 1 of 2 rows; worst at area = 200 mm\^2, gap = 5 mm\)/);
  });

  it("writes CSV (result and error columns) to stdout and the messages to stderr with --csv", () => {
    const r = cli("columns", "parallelPlateCapacitance", "good.csv", "area=1 cm^2", "--csv");
    expect(r.status).toBe(0);
    const v = (gap: string): number => evaluate("parallelPlateCapacitance", { area: "1 cm^2", gap }).value as number;
    expect(r.out).toBe(`parallelPlateCapacitance (F),error\n${v("0.1 mm")},\n${v("200 um")},\n`);
    // 0.1 mm and 0.2 mm over 1 cm^2 are 1 % and 2 % of the plate size: the fringing warning, on stderr.
    expect(r.err).toMatch(/^warning \[fringing\].*\(at 1 of 2 rows; worst at gap = 200 um\)\n$/);
  });

  it("writes JSON with null for failed rows' values and their codes with --json", () => {
    const r = cli("columns", "parallelPlateCapacitance", "parts.csv", "--json");
    const j = JSON.parse(r.out) as { output: { values: (number | null)[] }; errors: (string | null)[]; rowErrors: { code: string; first: { row: number } }[] };
    expect(j.output.values[1]).toBeNull();
    expect(j.errors).toEqual([null, "out_of_domain", null]);
    expect(j.rowErrors[0]).toMatchObject({ code: "out_of_domain", first: { row: 1 } });
  });

  it("refuses a missing file, a missing argument and a column given twice with coded errors", () => {
    expect(cli("columns", "parallelPlateCapacitance", "none.csv")).toMatchObject({ status: 1, err: expect.stringContaining('error [invalid_argument]: input "file"') });
    expect(cli("columns", "parallelPlateCapacitance").status).toBe(2);
    expect(cli("columns", "parallelPlateCapacitance", "good.csv", "gap=1 mm", "area=1")).toMatchObject({ status: 1, err: expect.stringContaining('input "gap"') });
    const j = JSON.parse(cli("columns", "parallelPlateCapacitance", "none.csv", "--json").out) as { error: { code: string; input: string } };
    expect(j.error).toMatchObject({ code: "invalid_argument", input: "file" });
  });
});
