// The run-time face: unit strings through evaluate(), relation and domain
// errors with codes and input names, validity warnings and safety cautions.
import { describe, expect, it } from "vitest";
import {
  capacitorCharge, capacitorEnergy, coaxialCapacitance, evaluate, getFormula,
  isolatedSphereCapacitance, parallelPlateCapacitance, quantity, sphericalCapacitance, twoWireCapacitance,
  wireOverPlaneCapacitance, type Length,
} from "../../src/index.js";
import { expectFormulaError } from "../helpers/errors.js";

const m = (v: number) => v as Length;
const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);


const IDS = [
  "parallelPlateCapacitance", "coaxialCapacitance", "sphericalCapacitance", "isolatedSphereCapacitance",
  "twoWireCapacitance", "wireOverPlaneCapacitance", "capacitorEnergy", "capacitorCharge",
  "seriesCapacitance", "parallelCapacitance",
];

describe("capacitance formulas through evaluate", () => {
  it("every capacitance formula is in the registry and its examples evaluate to a finite value", () => {
    for (const id of IDS) {
      const f = getFormula(id);
      const inputs = Object.fromEntries(Object.entries(f.definition.inputs).map(([k, s]) => [k, (s as { example: number }).example]));
      const r = evaluate(id, inputs);
      expect(Number.isFinite(r.value)).toBe(true);
      expect(r.value as number).toBeGreaterThan(0);
    }
  });

  it("unit strings give the same value as the typed call", () => {
    const pairs: [string, Record<string, string | number>, number][] = [
      ["parallelPlateCapacitance", { area: "1 cm^2", gap: "0.1 mm", relativePermittivity: 4.4 },
        parallelPlateCapacitance({ area: quantity(1, "cm^2"), gap: quantity(0.1, "mm"), relativePermittivity: 4.4 })],
      ["coaxialCapacitance", { innerRadius: "0.45 mm", outerRadius: "1.47 mm", length: "2 m", relativePermittivity: "2.25" },
        coaxialCapacitance({ innerRadius: quantity(0.45, "mm"), outerRadius: quantity(1.47, "mm"), length: quantity(2, "m"), relativePermittivity: 2.25 })],
      ["sphericalCapacitance", { innerRadius: "10 cm", outerRadius: "20 cm" },
        sphericalCapacitance({ innerRadius: quantity(10, "cm"), outerRadius: quantity(20, "cm") })],
      ["isolatedSphereCapacitance", { radius: "6371 km" }, isolatedSphereCapacitance({ radius: quantity(6371, "km") })],
      ["twoWireCapacitance", { wireRadius: "0.5 mm", separation: "5 mm", length: "1 m" },
        twoWireCapacitance({ wireRadius: quantity(0.5, "mm"), separation: quantity(5, "mm"), length: quantity(1, "m") })],
      ["wireOverPlaneCapacitance", { wireRadius: "0.5 mm", height: "1 cm", length: "30 cm" },
        wireOverPlaneCapacitance({ wireRadius: quantity(0.5, "mm"), height: quantity(1, "cm"), length: quantity(30, "cm") })],
      ["capacitorEnergy", { capacitance: "100 uF", voltage: "400 V" },
        capacitorEnergy({ capacitance: quantity(100, "uF"), voltage: quantity(400, "V") })],
      ["capacitorCharge", { capacitance: "100 pF", voltage: "-5 kV" },
        capacitorCharge({ capacitance: quantity(100, "pF"), voltage: quantity(-5, "kV") })],
    ];
    for (const [id, inputs, typed] of pairs) {
      const r = evaluate(id, inputs);
      expect(rel(r.value as number, typed), id).toBeLessThan(1e-15);
    }
    expect(evaluate("capacitorEnergy", { capacitance: "100 uF", voltage: "400 V" }).unit).toBe("J");
    expect(evaluate("capacitorCharge", { capacitance: "100 uF", voltage: "400 V" }).unit).toBe("C");
    expect(evaluate("coaxialCapacitance", { innerRadius: "1 mm", outerRadius: "2 mm", length: "1 m" }).unit).toBe("F");
  });

  it("geometry contradictions fail as out_of_domain with a rule naming both inputs", () => {
    const cases: [string, Record<string, string>, string[]][] = [
      ["coaxialCapacitance", { innerRadius: "2 mm", outerRadius: "1 mm", length: "1 m" }, ["innerRadius", "outerRadius"]],
      ["coaxialCapacitance", { innerRadius: "1 mm", outerRadius: "1 mm", length: "1 m" }, ["innerRadius", "outerRadius"]],
      ["sphericalCapacitance", { innerRadius: "3 cm", outerRadius: "2 cm" }, ["innerRadius", "outerRadius"]],
      ["twoWireCapacitance", { wireRadius: "1 mm", separation: "2 mm", length: "1 m" }, ["wireRadius", "separation"]],
      ["twoWireCapacitance", { wireRadius: "1 mm", separation: "1.5 mm", length: "1 m" }, ["wireRadius", "separation"]],
      ["wireOverPlaneCapacitance", { wireRadius: "1 mm", height: "1 mm", length: "1 m" }, ["wireRadius", "height"]],
    ];
    for (const [id, inputs, names] of cases) {
      const e = expectFormulaError(() => evaluate(id, inputs));
      expect(e.code).toBe("out_of_domain");
      for (const n of names) expect(e.rule).toContain(n);
    }
  });

  it("bad single inputs name the input and never produce NaN or a TypeError", () => {
    const e1 = expectFormulaError(() => evaluate("coaxialCapacitance", { innerRadius: "-1 mm", outerRadius: "2 mm", length: "1 m" }));
    expect([e1.code, e1.input]).toEqual(["out_of_domain", "innerRadius"]);
    const e2 = expectFormulaError(() => evaluate("twoWireCapacitance", { wireRadius: "1 mm", separation: "5 pF", length: "1 m" }));
    expect([e2.code, e2.input]).toEqual(["wrong_dimension", "separation"]);
    const e3 = expectFormulaError(() => coaxialCapacitance({ innerRadius: m(1e-3), outerRadius: m(Number.NaN), length: m(1) }));
    expect([e3.code, e3.input]).toEqual(["not_finite", "outerRadius"]);
    const e4 = expectFormulaError(() => isolatedSphereCapacitance({ radius: m(1), relativePermittivity: 0.5 }));
    expect([e4.code, e4.input]).toEqual(["out_of_domain", "relativePermittivity"]);
    const e5 = expectFormulaError(() => evaluate("capacitorEnergy", { capacitance: "0 F", voltage: "1 V" }));
    expect([e5.code, e5.input]).toEqual(["out_of_domain", "capacitance"]);
    const e6 = expectFormulaError(() => evaluate("wireOverPlaneCapacitance", { wireRadius: "1 mm", length: "1 m" }));
    expect([e6.code, e6.input]).toEqual(["missing_input", "height"]);
  });
});

describe("capacitance validity warnings", () => {
  const codes = (notes: readonly { code: string }[]) => notes.map((n) => n.code);

  it("the parallel-plate fringing warning prints a plain percentage", () => {
    const r = parallelPlateCapacitance.details({ area: quantity(1, "cm^2"), gap: quantity(1, "cm") });
    expect(r.warnings).toHaveLength(1);
    expect(r.warnings[0]!.message).toContain("gap is 100 % of the plate size");
    expect(r.warnings[0]!.message).not.toMatch(/e\+/);
    expect(parallelPlateCapacitance.details({ area: quantity(1, "cm^2"), gap: quantity(0.05, "mm") }).warnings).toEqual([]);
  });

  it("short lines warn about end effects with the estimated size, long lines do not", () => {
    const shortCoax = coaxialCapacitance.details({ innerRadius: m(1e-3), outerRadius: m(3e-3), length: m(0.1) });
    expect(codes(shortCoax.warnings)).toEqual(["end_effects"]);
    expect(shortCoax.warnings[0]!.message).toContain("2 %");
    expect(coaxialCapacitance.details({ innerRadius: m(1e-3), outerRadius: m(3e-3), length: m(1) }).warnings).toEqual([]);
    expect(codes(twoWireCapacitance.details({ wireRadius: m(1e-3), separation: m(5e-2), length: m(1) }).warnings)).toEqual(["end_effects"]);
    expect(twoWireCapacitance.details({ wireRadius: m(1e-3), separation: m(5e-3), length: m(1) }).warnings).toEqual([]);
    expect(codes(wireOverPlaneCapacitance.details({ wireRadius: m(1e-3), height: m(0.2), length: m(1) }).warnings)).toEqual(["end_effects"]);
  });

  it("wire formulas warn that the permittivity must fill all space when it is above 1", () => {
    const r = twoWireCapacitance.details({ wireRadius: m(1e-3), separation: m(5e-3), length: m(1), relativePermittivity: 3 });
    expect(codes(r.warnings)).toEqual(["dielectric"]);
    const p = wireOverPlaneCapacitance.details({ wireRadius: m(1e-3), height: m(5e-3), length: m(1), relativePermittivity: 3 });
    expect(codes(p.warnings)).toEqual(["dielectric"]);
  });
});

describe("stored-energy cautions", () => {
  const codes = (notes: readonly { code: string }[]) => notes.map((n) => n.code);
  const energy = (c: number, v: number) => evaluate("capacitorEnergy", { capacitance: c, voltage: v });
  const charge = (c: number, v: number) => evaluate("capacitorCharge", { capacitance: c, voltage: v });

  it("a small capacitor at extra-low voltage carries no caution", () => {
    expect(energy(1e-9, 12).cautions).toEqual([]);
    expect(charge(10e-6, 24).cautions).toEqual([]);
    expect(energy(1e-12, 120).cautions).toEqual([]); // 120 V d.c. is still band I (IEC 60449, from memory)
  });

  it("uses the library's d.c. voltage bands: above 120 V and above 1500 V (IEC 61140 / IEC 60449), either sign", () => {
    expect(codes(energy(1e-12, 130).cautions)).toEqual(["above_extra_low_voltage"]);
    expect(codes(charge(1e-12, -130).cautions)).toEqual(["above_extra_low_voltage"]);
    expect(codes(energy(1e-15, 1500).cautions)).toEqual(["above_extra_low_voltage"]);
    expect(codes(energy(1e-15, -1600).cautions)).toEqual(["high_voltage"]);
    expect(energy(1e-12, 130).cautions[0]!.message).toMatch(/120 V/);
    expect(energy(1e-12, 130).cautions[0]!.message).toMatch(/licensed practice govern/);
  });

  it("charge beyond the IEC 60335-1 clause 8.1.4 discharge limits is cautioned with handling advice and its ratio to the limit", () => {
    // Limits (IEC 60335-1 clause 8.1.4, quoted from a secondary source, from memory): above 42.4 V peak,
    // 0.1 uF up to 450 V; 45 uC up to 15 kV; 350 mJ above 15 kV.
    expect(codes(charge(0.2e-6, 100).cautions)).toEqual(["stored_charge"]);
    expect(charge(0.2e-6, 42).cautions).toEqual([]);
    expect(charge(0.05e-6, 100).cautions).toEqual([]);
    expect(codes(charge(0.05e-6, 1000).cautions)).toEqual(["above_extra_low_voltage", "stored_charge"]); // 50 uC
    expect(codes(charge(0.04e-6, 1000).cautions)).toEqual(["above_extra_low_voltage"]); // 40 uC
    expect(codes(charge(4e-9, 20e3).cautions)).toEqual(["high_voltage", "stored_charge"]); // 0.8 J
    expect(codes(charge(1e-9, 20e3).cautions)).toEqual(["high_voltage"]); // 0.2 J
    const msg = charge(0.2e-6, 100).cautions[0]!.message;
    expect(msg).toMatch(/2 times the limit/);
    expect(msg).toMatch(/bleed resistor/);
    expect(msg).toMatch(/licensed practice govern/);
  });

  it("stored energy from 20 J (the IEC 60950-1 hazardous energy level) is cautioned, below it not", () => {
    const r = energy(1e-3, 400); // 80 J
    expect(codes(r.cautions)).toEqual(["above_extra_low_voltage", "stored_charge", "stored_energy"]);
    expect(r.cautions[2]!.message).toContain("80 J");
    expect(r.cautions[2]!.message).toContain("20 J");
    expect(codes(energy(2.5e-4, 400).cautions)).toContain("stored_energy"); // exactly 20 J
    expect(codes(energy(2.4e-4, 400).cautions)).not.toContain("stored_energy"); // 19.2 J
    expect(codes(energy(100e-6, 400).cautions)).not.toContain("stored_energy"); // 8 J
  });

  it("every caution has a measure that grows with the hazard", () => {
    const def = capacitorEnergy.definition;
    const at = (c: number, v: number) => Object.fromEntries(
      def.cautions!.map((k) => [k.code, k.measure!({ capacitance: c, voltage: v }, (c * v * v) / 2)]),
    );
    const low = at(1e-3, 400), high = at(1e-3, 800);
    for (const code of Object.keys(low)) expect(high[code]!, code).toBeGreaterThan(low[code]!);
    expect(at(1e-3, 400)["stored_energy"]).toBe(80);
    expect(at(1e-3, 1e200)["stored_charge"]).toBe(Number.MAX_VALUE); // capped, never Infinity
  });
});
