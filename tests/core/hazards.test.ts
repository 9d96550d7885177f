import { describe, expect, it } from "vitest";
import { GOVERN, magnitude, strongFieldCaution, voltageCautions } from "../../src/core/hazards.js";

// Thresholds and their documents (from memory, as src/core/hazards.ts says):
// ICNIRP 2010 power-frequency reference levels 200 uT (public) and 1 mT (workers);
// ICNIRP 2009 static fields: 0.5 mT implant line, 400 mT public limit; about 3 mT
// for loose iron (MRI site practice, common practice). IEC 60449 / IEC 61140
// voltage bands: 50 V a.c. / 120 V d.c. and 1000 V a.c. / 1500 V d.c.

const field = strongFieldCaution();
const fires = (b: number) => field.when(undefined, b);
const says = (b: number) => field.message(undefined, b);

describe("the strong-field rule", () => {
  it("fires from the ICNIRP 2010 public power-frequency reference level, 200 uT, and not below", () => {
    expect(fires(199.9e-6)).toBe(false);
    expect(fires(200e-6)).toBe(true);
    expect(field.measure(undefined, [3e-4, 4e-4, 0])).toBeCloseTo(5e-4, 15);
  });

  it("names the static implant line only from 0.5 mT, loose iron from 3 mT and the public static limit from 400 mT", () => {
    expect(says(0.3e-3)).toMatch(/below the 0\.5 mT line/);
    expect(says(0.3e-3)).toMatch(/public \(200 uT; workers 1 mT\)/);
    expect(says(0.5e-3)).toMatch(/at or above the 0\.5 mT \(5 G\) line/);
    expect(says(2.9e-3)).not.toMatch(/pulled in/);
    expect(says(3e-3)).toMatch(/pulled in/);
    expect(says(3e-3)).toMatch(/for the public \(200 uT\) and for workers \(1 mT\)/);
    expect(says(0.39)).not.toMatch(/400 mT/);
    expect(says(0.4)).toMatch(/static-field limit for the public \(400 mT\)/);
  });

  it("ends with the statement that local codes and licensed practice govern, and prints huge fields in tesla", () => {
    expect(says(1e-3).endsWith(GOVERN)).toBe(true);
    expect(says(1.7e308)).toMatch(/flux density 170e306 T/);
    expect(says(1.7e308)).not.toMatch(/Infinity|NaN/);
  });
});

describe("the strong-field rule cites the exposure reference levels for the field's waveform", () => {
  // ICNIRP 2010 Tables 3 and 4 (1 kHz: public 8e-2/f T = 80 uT, workers 0.3/f T = 300 uT); ICNIRP 2009 static
  // limits 400 mT (public) and 2 T (workers, head and trunk); the 0.5 mT implant line (from memory).
  const stat = strongFieldCaution(undefined, "static");
  const kHz = strongFieldCaution<{ readonly frequency: number }>(undefined, (x) => x.frequency);
  const at1k = { frequency: 1000 };

  it("fires for a static field from the 0.5 mT implant line, not from the 200 uT power-frequency level", () => {
    expect(stat.when(undefined, 0.4999e-3)).toBe(false);
    expect(stat.when(undefined, 0.5e-3)).toBe(true);
    expect(stat.message(undefined, 0.5e-3)).toMatch(/at or above the 0\.5 mT \(5 G\) line/);
    expect(stat.message(undefined, 0.5e-3)).not.toMatch(/power frequency|50-60 Hz/);
  });

  it("compares a static field with the ICNIRP 2009 limits: the public's 400 mT, then the workers' 2 T", () => {
    expect(stat.message(undefined, 0.399)).not.toMatch(/400 mT/);
    expect(stat.message(undefined, 0.4)).toMatch(/static-field limit for the public \(400 mT\)/);
    expect(stat.message(undefined, 1.99)).not.toMatch(/for workers/);
    expect(stat.message(undefined, 2)).toMatch(/for the public \(400 mT\) and for workers \(2 T head and trunk; limbs 8 T\)/);
  });

  it("fires at a known frequency from the public reference level there (80 uT at 1 kHz) and names the workers' level (300 uT)", () => {
    expect(kHz.when(at1k, 79.9e-6)).toBe(false);
    expect(kHz.when(at1k, 80e-6)).toBe(true);
    expect(kHz.message(at1k, 80e-6)).toMatch(/at 1000 Hz it exceeds the ICNIRP 2010 reference level for the public \(80 uT; workers 300 uT\)/);
    expect(kHz.message(at1k, 299e-6)).not.toMatch(/and for workers/);
    expect(kHz.message(at1k, 300e-6)).toMatch(/for the public \(80 uT\) and for workers \(300 uT\)/);
    // At 50 Hz the public level is 200 uT; below 1 Hz the static lines apply.
    expect(kHz.when({ frequency: 50 }, 199e-6)).toBe(false);
    expect(kHz.when({ frequency: 50 }, 200e-6)).toBe(true);
    expect(kHz.when({ frequency: 0.5 }, 0.4e-3)).toBe(false);
    expect(kHz.when({ frequency: 0.5 }, 0.5e-3)).toBe(true);
  });

  it("keeps firing above the tables' 10 MHz end from their last public level and says the radio-frequency guidelines apply", () => {
    expect(kHz.when({ frequency: 20e6 }, 26e-6)).toBe(false);
    expect(kHz.when({ frequency: 20e6 }, 27e-6)).toBe(true);
    expect(kHz.message({ frequency: 20e6 }, 27e-6)).toMatch(/radio-frequency guidelines/);
  });
});

describe("the voltage-band rules", () => {
  const codes = (kind: "ac" | "dc", v: number) =>
    voltageCautions(kind).filter((c) => c.when(undefined, v)).map((c) => c.code);

  it("use the a.c. bands: above 50 V is above extra-low voltage, above 1000 V is high voltage", () => {
    expect(codes("ac", 50)).toEqual([]);
    expect(codes("ac", 50.01)).toEqual(["above_extra_low_voltage"]);
    expect(codes("ac", 1000)).toEqual(["above_extra_low_voltage"]);
    expect(codes("ac", 1000.1)).toEqual(["high_voltage"]);
  });

  it("use the d.c. bands: above 120 V, above 1500 V, on the magnitude of negative voltages too", () => {
    expect(codes("dc", 120)).toEqual([]);
    expect(codes("dc", -121)).toEqual(["above_extra_low_voltage"]);
    expect(codes("dc", 1500)).toEqual(["above_extra_low_voltage"]);
    expect(codes("dc", -1501)).toEqual(["high_voltage"]);
  });

  it("measure the voltage and end with the governing statement", () => {
    const [elv, hv] = voltageCautions("ac");
    expect(elv!.measure(undefined, -230)).toBe(230);
    expect(hv!.message(undefined, 11e3).endsWith(GOVERN)).toBe(true);
  });
});

describe("magnitude", () => {
  it("is the Euclidean norm without overflow in the squares", () => {
    expect(magnitude([3e300, 4e300, 0])).toBeCloseTo(5e300, -285);
    expect(magnitude([0, 0, 0])).toBe(0);
    expect(magnitude(-2)).toBe(2);
  });
});
