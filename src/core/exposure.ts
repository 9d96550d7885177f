/**
 * Exposure reference levels for people in low-frequency and static fields, as
 * data: the one table that the `exposureReferenceLevel` formula returns and the
 * strong-field caution (hazards.ts) compares with. Values in SI (T, V/m),
 * unperturbed r.m.s. fields.
 *
 * 1 Hz to 10 MHz: ICNIRP, "Guidelines for limiting exposure to time-varying
 * electric and magnetic fields (1 Hz to 100 kHz)", Health Physics 99(6) (2010)
 * 818-836, Table 3 (occupational) and Table 4 (general public); the tables run
 * to 10 MHz for effects on the nervous system, and above 100 kHz the
 * radio-frequency guidelines apply as well (table note). Checked against the
 * tables as reproduced in a bioelectromagnetism handbook (Table 7.3, "reproduced
 * from ICNIRP, Health Physics 99: 818-836, 2010") and the 60 Hz values quoted
 * on emftesting.net (1 mT / 8.3 kV/m occupational, 200 uT / 4.17 kV/m public).
 *
 * Below 1 Hz (static): ICNIRP, "Guidelines on limits of exposure to static
 * magnetic fields", Health Physics 96(4) (2009) 504-514: 400 mT for the public
 * (any part of the body), 2 T for workers (head and trunk; 8 T for the limbs);
 * checked against the summary in the ICES EMF database (study 1840). These are
 * exposure limits, not derived reference levels. ICNIRP 2009 has no static
 * electric-field level, and time-varying fields below 1 Hz (movement in a
 * static field) are the subject of a separate guideline (ICNIRP, Health
 * Physics 106(3) (2014) 418-425), not covered here.
 */

export type ExposureGroup = "public" | "occupational";
export type ExposureQuantity = "fluxDensity" | "electricField";

/** One row of a table: from `from` to `to` Hz the level is coefficient / f^power. */
interface Band {
  readonly from: number;
  readonly to: number;
  readonly coefficient: number;
  readonly power: 0 | 1 | 2;
  /** The row as the guideline prints it (f in Hz), for labels. */
  readonly text: string;
}

/** Upper end of the tables (Hz). */
export const REFERENCE_LEVEL_MAX_FREQUENCY = 10e6;
/** Above this frequency (Hz) the radio-frequency guidelines apply as well (heating). */
export const LOW_FREQUENCY_GUIDELINE_TOP = 100e3;
/** Below this frequency (Hz) the time-varying tables do not apply; the static-field guideline does. */
export const STATIC_BELOW = 1;

const TABLES: Readonly<Record<ExposureGroup, Readonly<Record<ExposureQuantity, readonly Band[]>>>> = {
  occupational: {
    fluxDensity: [
      { from: 1, to: 8, coefficient: 0.2, power: 2, text: "0.2/f^2 T" },
      { from: 8, to: 25, coefficient: 2.5e-2, power: 1, text: "2.5e-2/f T" },
      { from: 25, to: 300, coefficient: 1e-3, power: 0, text: "1e-3 T" },
      { from: 300, to: 3e3, coefficient: 0.3, power: 1, text: "0.3/f T" },
      { from: 3e3, to: 10e6, coefficient: 1e-4, power: 0, text: "1e-4 T" },
    ],
    electricField: [
      { from: 1, to: 25, coefficient: 2e4, power: 0, text: "20 kV/m" },
      { from: 25, to: 3e3, coefficient: 5e5, power: 1, text: "5e2/f kV/m" },
      { from: 3e3, to: 10e6, coefficient: 170, power: 0, text: "1.7e-1 kV/m" },
    ],
  },
  public: {
    fluxDensity: [
      { from: 1, to: 8, coefficient: 4e-2, power: 2, text: "4e-2/f^2 T" },
      { from: 8, to: 25, coefficient: 5e-3, power: 1, text: "5e-3/f T" },
      { from: 25, to: 400, coefficient: 2e-4, power: 0, text: "2e-4 T" },
      { from: 400, to: 3e3, coefficient: 8e-2, power: 1, text: "8e-2/f T" },
      { from: 3e3, to: 10e6, coefficient: 2.7e-5, power: 0, text: "2.7e-5 T" },
    ],
    electricField: [
      { from: 1, to: 50, coefficient: 5e3, power: 0, text: "5 kV/m" },
      { from: 50, to: 3e3, coefficient: 2.5e5, power: 1, text: "2.5e2/f kV/m" },
      { from: 3e3, to: 10e6, coefficient: 83, power: 0, text: "8.3e-2 kV/m" },
    ],
  },
};

/** Static magnetic-field exposure limits (T), ICNIRP 2009. */
export const STATIC_FIELD_LIMIT: Readonly<Record<ExposureGroup, number>> = { public: 0.4, occupational: 2 };
/** ICNIRP 2009: workers' limbs may take 8 T. */
export const STATIC_FIELD_LIMIT_LIMBS = 8;

/** A level with what it was read from. */
export interface ReferenceLevel {
  readonly value: number;
  /** The document, table and row, e.g. "ICNIRP 2010, Table 4 (general public), 400 Hz - 3 kHz: 8e-2/f T". */
  readonly label: string;
}

const GROUP_WORDS: Readonly<Record<ExposureGroup, string>> = { public: "general public", occupational: "occupational" };

/**
 * The reference level for a frequency (Hz, 0 for static), group and quantity,
 * or undefined where no level is set (a static electric field; above 10 MHz).
 * A frequency on the edge between two rows takes the lower of the two values
 * (the tables round their rows, so edges differ by up to 2 %): the protective reading.
 */
export function referenceLevel(frequency: number, group: ExposureGroup, quantity: ExposureQuantity): ReferenceLevel | undefined {
  if (!(frequency >= 0) || frequency > REFERENCE_LEVEL_MAX_FREQUENCY) return undefined;
  if (frequency < STATIC_BELOW) {
    if (quantity !== "fluxDensity") return undefined;
    const where = group === "public" ? "any part of the body" : "head and trunk; limbs 8 T";
    return { value: STATIC_FIELD_LIMIT[group], label: `ICNIRP 2009 static magnetic field, ${GROUP_WORDS[group]} exposure limit (${where})` };
  }
  const table = group === "public" ? "Table 4" : "Table 3";
  let best: ReferenceLevel | undefined;
  // At most five rows per table.
  for (const b of TABLES[group][quantity]) {
    if (frequency < b.from || frequency > b.to) continue;
    const value = b.power === 0 ? b.coefficient : b.power === 1 ? b.coefficient / frequency : b.coefficient / frequency / frequency;
    if (best === undefined || value < best.value) {
      best = { value, label: `ICNIRP 2010, ${table} (${GROUP_WORDS[group]}), ${hertz(b.from)} - ${hertz(b.to)}: ${b.text}` };
    }
  }
  return best;
}

function hertz(f: number): string {
  return f >= 1e6 ? `${f / 1e6} MHz` : f >= 1e3 ? `${f / 1e3} kHz` : `${f} Hz`;
}
