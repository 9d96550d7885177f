import { afterEach, describe, expect, it } from "vitest";
import type { Server } from "node:http";
import { serve } from "../../examples/http-handler.js";
import { createHandler } from "../../src/http/index.js";

let open: Server | undefined;
afterEach(async () => {
  await new Promise<void>((resolve) => (open ? open.close(() => resolve()) : resolve()));
  open = undefined;
});

describe("the example server", () => {
  it("binds the loopback interface unless told otherwise", async () => {
    const { server, address } = await serve({ port: 0 });
    open = server;
    expect(address.address).toBe("127.0.0.1");
    const res = await fetch(`http://127.0.0.1:${address.port}/formulas/parallelPlateCapacitance`);
    expect(res.status).toBe(200);
    expect(((await res.json()) as { id: string }).id).toBe("parallelPlateCapacitance");
  });

  it("passes its limits to the handler", async () => {
    const { server, address } = await serve({ port: 0, maxSweepPoints: 3 });
    open = server;
    const res = await fetch(`http://127.0.0.1:${address.port}/sweep`, {
      method: "POST",
      body: JSON.stringify({ formula: "parallelPlateCapacitance", vary: { gap: { from: "1 mm", to: "2 mm", points: 4 } }, fixed: { area: "1 cm^2" } }),
    });
    expect(res.status).toBe(422);
    expect(((await res.json()) as { error: unknown }).error).toMatchObject({ code: "over_limit", input: "points", limit: 3 });
  });

  it("runs a long request as a job, and closes its job store with the server", async () => {
    const { server, address, jobs } = await serve({ port: 0 });
    open = server;
    const base = `http://127.0.0.1:${address.port}`;
    const request = { formula: "parallelPlateCapacitance", vary: { gap: { from: "1 mm", to: "2 mm", points: 4 } }, fixed: { area: "1 cm^2" } };
    const submitted = await fetch(`${base}/jobs`, { method: "POST", body: JSON.stringify({ kind: "sweep", request }) });
    expect(submitted.status).toBe(202);
    const location = submitted.headers.get("location")!;
    let state = "queued";
    for (let i = 0; i < 2000 && (state === "queued" || state === "running"); i++) {
      await new Promise((r) => setTimeout(r, 5));
      state = ((await (await fetch(`${base}${location}`)).json()) as { state: string }).state;
    }
    expect(state).toBe("done");
    const result = (await (await fetch(`${base}${location}/result`)).json()) as { output: { values: number[] } };
    expect(result.output.values).toHaveLength(4);
    // Closing the server closes the store it made: every job cancelled and forgotten, no new one taken.
    await new Promise<void>((resolve) => server.close(() => resolve()));
    open = undefined;
    await jobs.idle();
    expect(createHandler({ jobs })({ method: "POST", path: "/jobs", body: { kind: "sweep", request } }).body).toMatchObject({ error: { code: "shutting_down" } });
    expect(jobs.counts()).toEqual({ queued: 0, running: 0, finished: 0 });
  });
});
