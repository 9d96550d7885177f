// Every warning and caution of the capacitance, displacement and force
// families that depends on the inputs has a measure (bulk tools report the
// worst point by it), and none of these families has a caution that fires on
// every call: each caution stays silent at some ordinary input.
import { describe, expect, it } from "vitest";
import * as capacitance from "../../src/capacitance/index.js";
import * as displacement from "../../src/displacement/index.js";
import { cyclotronFrequency, driftVelocity, gyroradius, hallVoltage, lorentzForce, magneticPressure, parallelWiresForce, relativisticGyroradius, wireForce } from "../../src/force/index.js";
import type { AnyFormula } from "../../src/core/formula.js";

const formulas = [
  ...Object.values(capacitance), ...Object.values(displacement),
  cyclotronFrequency, driftVelocity, gyroradius, hallVoltage, lorentzForce, magneticPressure, parallelWiresForce, relativisticGyroradius, wireForce,
] as unknown as AnyFormula[];

describe("notes of the capacitance, displacement and force families", () => {
  it("every condition with a threshold has a measure, and every caution has a threshold", () => {
    expect(formulas.length).toBe(26);
    for (const f of formulas) {
      const d = f.definition;
      for (const c of [...(d.validity ?? []), ...(d.cautions ?? [])]) {
        if (c.when) expect(typeof c.measure, `${f.id} ${c.code}`).toBe("function");
      }
      for (const c of d.cautions ?? []) expect(typeof c.when, `${f.id} ${c.code} fires on every call`).toBe("function");
    }
  });

  it("every caution message names its threshold's document or says common practice, and ends with the governing sentence", () => {
    for (const f of formulas) {
      const d = f.definition;
      for (const c of d.cautions ?? []) {
        if (typeof c.message !== "function") continue;
        // Evaluate the message at the formula's examples: the text is built from the inputs.
        const x = f.inputsObject(Object.fromEntries(Object.entries(d.inputs).map(([k, s]) => [k, (s as { example: unknown }).example])));
        const text = c.message(x as never, f.run(x) as never);
        expect(text, `${f.id} ${c.code}`).toMatch(/IEC|ICNIRP|common practice/);
        expect(text, `${f.id} ${c.code}`).toMatch(/Local codes, standards and licensed practice govern any real installation\.$/);
      }
    }
  });
});
