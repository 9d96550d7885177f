import { afterEach, describe, expect, it } from "vitest";
import type { Server } from "node:http";
import { serve } from "../../examples/http-handler.js";

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
});
