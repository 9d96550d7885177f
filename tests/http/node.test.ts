import type { AddressInfo } from "node:net";
import { createServer, request } from "node:http";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createRequestListener } from "../../src/http/index.js";
import { listFormulas } from "../../src/core/registry.js";

const server = createServer(createRequestListener({ maxBodyBytes: 64 * 1024 }));
let base = "";

beforeAll(async () => {
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
});
afterAll(async () => {
  await new Promise<void>((resolve) => server.close(() => resolve()));
});

async function call(method: string, path: string, body?: unknown, raw?: string): Promise<{ status: number; json: any; headers: Headers }> {
  const init: RequestInit = { method };
  if (raw !== undefined) init.body = raw;
  else if (body !== undefined) init.body = JSON.stringify(body);
  if (init.body !== undefined) init.headers = { "content-type": "application/json" };
  const res = await fetch(`${base}${path}`, init);
  return { status: res.status, json: await res.json(), headers: res.headers };
}

describe("the node:http request listener over loopback", () => {
  it("evaluates with unit strings and returns warnings and cautions", async () => {
    const r = await call("POST", "/evaluate", { formula: "parallelPlateCapacitance", inputs: { area: "1 cm^2", gap: "2 mm" } });
    expect(r.status).toBe(200);
    expect(r.json.unit).toBe("F");
    expect(r.json.value).toBeCloseTo(8.8541878188e-12 * 1e-4 / 2e-3, 25);
    expect(r.json.warnings[0].code).toBe("fringing");
    expect(r.json.cautions).toEqual([]);
  });

  it("solves and runs a tolerance analysis", async () => {
    const s = await call("POST", "/solve", { formula: "parallelPlateCapacitance", solveFor: "gap", target: "100 pF", inputs: { area: "1 cm^2" } });
    expect(s.status).toBe(200);
    expect(s.json.value).toBeCloseTo(8.8541878188e-6, 15);
    const t = await call("POST", "/tolerance", { formula: "parallelPlateCapacitance", inputs: { area: "1 cm^2", gap: { nominal: "0.1 mm", percent: 5 } }, options: { samples: 1000 } });
    expect(t.status).toBe(200);
    expect(t.json.monteCarlo.samples).toBe(1000);
  });

  it("sweeps, with null for points not computed, and refuses oversized grids", async () => {
    const r = await call("POST", "/sweep", { formula: "parallelPlateCapacitance", vary: { relativePermittivity: { from: 0, to: 4, points: 5 } }, fixed: { area: "1 cm^2", gap: "1 mm" } });
    expect(r.status).toBe(200);
    expect(r.json.output.values[0]).toBeNull();
    expect(r.json.output.values[4]).toBeCloseTo(8.8541878188e-12 * 4 * 1e-4 / 1e-3, 25);
    expect(r.json.notComputed).toBe(1);
    const big = await call("POST", "/sweep", { formula: "parallelPlateCapacitance", vary: { gap: { from: 1e-4, to: 1e-3, points: 1e6 } }, fixed: { area: 1e-4 } });
    expect(big.status).toBe(422);
  });

  it("gives every response with a result its notes: evaluate, solve, tolerance and sweep", async () => {
    // gap / sqrt(area) = 20 % on 1 cm^2 plates: the fringing warning applies (common practice threshold 1 %).
    const e = await call("POST", "/evaluate", { formula: "parallelPlateCapacitance", inputs: { area: "1 cm^2", gap: "2 mm" } });
    expect(e.json.warnings[0].code).toBe("fringing");
    const s = await call("POST", "/solve", { formula: "parallelPlateCapacitance", solveFor: "gap", target: "0.4427 pF", inputs: { area: "1 cm^2" } });
    expect(s.json.warnings[0].code).toBe("fringing");
    const t = await call("POST", "/tolerance", { formula: "parallelPlateCapacitance", inputs: { area: "1 cm^2", gap: { nominal: "2 mm", percent: 5 } }, options: { samples: 100 } });
    expect(t.json.notes[0]).toMatchObject({ code: "fringing", kind: "warning", count: t.json.notesOver });
    const w = await call("POST", "/sweep", { formula: "parallelPlateCapacitance", vary: { gap: { from: "0.01 mm", to: "2 mm", points: 5 } }, fixed: { area: "1 cm^2" } });
    expect(w.json.notes[0]).toMatchObject({ code: "fringing", kind: "warning", count: 4 });
    expect(w.json.notes[0].worst.message).toMatch(/fringing/);
  });

  it("lists formulas and serves one with its input schema", async () => {
    const all = await call("GET", "/formulas");
    expect(all.status).toBe(200);
    expect(all.json.map((e: { id: string }) => e.id)).toEqual(listFormulas().map((f) => f.id));
    const one = await call("GET", "/formulas/parallelPlateCapacitance");
    expect(one.json.inputSchema.required).toEqual(["area", "gap"]);
    expect((await call("GET", "/formulas/noSuchFormula")).status).toBe(404);
  });

  it("answers bad input with 4xx and { error: { code, message, input } }, never 500", async () => {
    const dim = await call("POST", "/evaluate", { formula: "parallelPlateCapacitance", inputs: { area: "1 kg", gap: "1 mm" } });
    expect(dim.status).toBe(422);
    expect(dim.json.error).toMatchObject({ code: "wrong_dimension", input: "area" });
    expect(typeof dim.json.error.message).toBe("string");
    const none = await call("POST", "/solve", { formula: "parallelPlateCapacitance", solveFor: "relativePermittivity", target: "1 pF", inputs: { area: "1 cm^2", gap: "0.1 mm" } });
    expect(none.status).toBe(422);
    expect(none.json.error.code).toBe("no_solution");
    const json = await call("POST", "/evaluate", undefined, "{ not json");
    expect(json.status).toBe(400);
    expect(json.json.error.code).toBe("bad_json");
    const arr = await call("POST", "/evaluate", [1, 2]);
    expect(arr.status).toBe(400);
    const method = await call("GET", "/evaluate");
    expect(method.status).toBe(405);
    expect(method.headers.get("allow")).toBe("POST");
    expect((await call("DELETE", "/formulas")).status).toBe(405);
    expect((await call("POST", "/nowhere", {})).status).toBe(404);
    const odd: string[] = [
      JSON.stringify({ formula: 42, inputs: {} }),
      JSON.stringify({ formula: "parallelPlateCapacitance", inputs: "area" }),
      JSON.stringify({ formula: "parallelPlateCapacitance", inputs: { area: { nominal: 1 }, gap: null } }),
      '{"formula": "parallelPlateCapacitance", "inputs": {"__proto__": {"area": 1}, "constructor": "x"}}',
      '{"formula": "parallelPlateCapacitance", "solveFor": {}, "target": [1]}',
      '{"formula": "parallelPlateCapacitance", "vary": {"gap": {"from": "x", "to": 1, "points": 2}}, "fixed": []}',
      '{"formula": "parallelPlateCapacitance", "vary": {"gap": null}, "inputs": {"area": 1}}',
    ];
    for (const body of odd) {
      const r = await call("POST", "/evaluate", undefined, body);
      expect(r.status, body).toBeGreaterThanOrEqual(400);
      expect(r.status, body).toBeLessThan(500);
      const s = await call("POST", "/solve", undefined, body);
      expect(s.status, body).toBeGreaterThanOrEqual(400);
      expect(s.status, body).toBeLessThan(500);
      for (const route of ["/tolerance", "/sweep"]) {
        const t = await call("POST", route, undefined, body);
        expect(t.status, `${route} ${body}`).toBeGreaterThanOrEqual(400);
        expect(t.status, `${route} ${body}`).toBeLessThan(500);
      }
    }
    const tol = await call("POST", "/tolerance", { formula: "parallelPlateCapacitance", inputs: { area: 1e-4, gap: 1e-4 }, options: { samples: 1e9 } });
    expect(tol.status).toBe(422);
  });

  it("refuses a body over the limit with 413 without reading it all", async () => {
    const big = JSON.stringify({ formula: "parallelPlateCapacitance", inputs: { area: "1 cm^2", gap: "1 mm" }, pad: "x".repeat(100 * 1024) });
    const declared = await call("POST", "/evaluate", undefined, big);
    expect(declared.status).toBe(413);
    expect(declared.json.error.code).toBe("body_too_large");
    // Chunked (no length given): the limit applies while reading.
    const status = await new Promise<number>((resolve, reject) => {
      let answered = false;
      const req = request(`${base}/evaluate`, { method: "POST", headers: { "content-type": "application/json", "transfer-encoding": "chunked" } }, (res) => {
        answered = true;
        res.resume();
        resolve(res.statusCode ?? 0);
      });
      // The server closes the connection after answering; a write error after that is expected.
      req.on("error", (e) => (answered ? undefined : reject(e)));
      for (let i = 0; i < 10; i++) req.write("x".repeat(16 * 1024));
      req.end();
    });
    expect(status).toBe(413);
  });
});
