import { type ExposureGroup, REFERENCE_LEVEL_MAX_FREQUENCY, referenceLevel, STATIC_BELOW, STATIC_FIELD_LIMIT } from "./exposure.js";
import { formatNumber } from "./format.js";

/**
 * The hazard rules shared by every family: one rule per hazard, each with the
 * threshold where the hazard is real and the document that sets it. Formulas
 * spread these into their `cautions`; a family never writes its own copy.
 * Thresholds marked "from memory" were recalled, not looked up in the
 * document; they are the commonly quoted figures.
 */

/** Closing sentence of every caution. */
export const GOVERN = "Local codes, standards and licensed practice govern any real installation.";

/** A value or a vector of components, as conditions receive it. */
type Value = number | readonly number[];

// ---- magnetic fields ----

/**
 * Static fields: 0.5 mT (5 G), the line beyond which implanted medical devices
 * (pacemakers, defibrillators) may be affected. ICNIRP, "Guidelines on limits
 * of exposure to static magnetic fields", Health Physics 96(4) (2009) 504-514,
 * recommends keeping people with implants below it (from memory).
 */
export const IMPLANT_STATIC_FIELD = 0.5e-3;
/** Static fields: ICNIRP 2009 exposure limit for the general public, 400 mT (the exposure table, src/core/exposure.ts). */
export const PUBLIC_STATIC_FIELD_LIMIT = STATIC_FIELD_LIMIT.public;
/**
 * Power-frequency (50-60 Hz) reference levels, read from the ICNIRP 2010
 * tables (src/core/exposure.ts): 200 uT for the general public (Table 4),
 * 1 mT for workers (Table 3); the lower of the 50 Hz and 60 Hz readings.
 */
export const PUBLIC_POWER_FREQUENCY_FIELD = powerFrequencyLevel("public");
export const OCCUPATIONAL_POWER_FREQUENCY_FIELD = powerFrequencyLevel("occupational");
/** Above about 3 mT loose ferromagnetic parts can be pulled in (MRI site practice; common practice, from memory). */
export const PROJECTILE_FIELD = 3e-3;

function powerFrequencyLevel(group: ExposureGroup): number {
  return Math.min(referenceLevel(50, group, "fluxDensity")!.value, referenceLevel(60, group, "fluxDensity")!.value);
}

/**
 * What a formula knows of its field's time dependence: "static" (a permanent
 * magnet, a d.c. bending magnet), a frequency in Hz picked from the inputs, or
 * "unknown" (a field computed from a current that may alternate).
 */
export type Waveform<X> = "static" | "unknown" | ((x: X) => number);

/**
 * The one strong-field rule, citing the exposure reference levels
 * (src/core/exposure.ts) for the field's waveform:
 * - "static": fires from the 0.5 mT implant line and compares with the ICNIRP
 *   2009 static limits (400 mT public, 2 T workers);
 * - a frequency f: fires from the ICNIRP 2010 public reference level at f and
 *   compares with the occupational one (below 1 Hz, as static);
 * - "unknown": fires from the lowest level that applies to either reading (the
 *   50-60 Hz public level, 200 uT) and says which lines the field passes as a
 *   static field and at power frequency.
 * `flux` picks the flux density (T) from the inputs and result; default |value|.
 */
export function strongFieldCaution<X>(flux: (x: X, value: Value) => number = (_x, v) => magnitude(v), waveform: Waveform<X> = "unknown") {
  const frequency = (x: X): number | undefined => (typeof waveform === "function" ? waveform(x) : waveform === "static" ? 0 : undefined);
  return {
    code: "strong_field",
    when: (x: X, v: Value): boolean => flux(x, v) >= firstLine(frequency(x)),
    measure: (x: X, v: Value): number => flux(x, v),
    message: (x: X, v: Value): string => strongFieldMessage(flux(x, v), frequency(x)),
  } as const;
}

/** The field from which the rule fires: the lowest line that applies to the waveform. */
function firstLine(f: number | undefined): number {
  if (f === undefined) return Math.min(PUBLIC_POWER_FREQUENCY_FIELD, IMPLANT_STATIC_FIELD);
  if (!(f >= STATIC_BELOW)) return IMPLANT_STATIC_FIELD;
  // Above the tables' 10 MHz their last row is the nearest guidance: the lowest level they give.
  return (referenceLevel(f, "public", "fluxDensity") ?? referenceLevel(REFERENCE_LEVEL_MAX_FREQUENCY, "public", "fluxDensity")!).value;
}

function strongFieldMessage(b: number, f: number | undefined): string {
  const parts: string[] = [];
  if (f === undefined) {
    parts.push(
      b >= OCCUPATIONAL_POWER_FREQUENCY_FIELD
        ? `if it alternates at power frequency (50-60 Hz), it exceeds the ICNIRP 2010 reference levels for the public (${tesla(PUBLIC_POWER_FREQUENCY_FIELD)}) and for workers (${tesla(OCCUPATIONAL_POWER_FREQUENCY_FIELD)})`
        : `if it alternates at power frequency (50-60 Hz), it exceeds the ICNIRP 2010 reference level for the public (${tesla(PUBLIC_POWER_FREQUENCY_FIELD)}; workers ${tesla(OCCUPATIONAL_POWER_FREQUENCY_FIELD)})`,
    );
  } else if (f >= STATIC_BELOW) {
    parts.push(alternatingPart(b, f));
  }
  const staticPrefix = f === undefined ? "as a static field it is" : "it is";
  if (f === undefined || f < STATIC_BELOW) {
    if (b >= IMPLANT_STATIC_FIELD) {
      parts.push(`${staticPrefix} at or above the 0.5 mT (5 G) line for pacemakers and other implanted medical devices (ICNIRP 2009 static-field guideline): mark and restrict the area`);
    } else {
      parts.push(`${staticPrefix} below the 0.5 mT line for implanted medical devices (ICNIRP 2009)`);
    }
  }
  if (b >= PROJECTILE_FIELD) parts.push("loose iron and steel parts can be pulled in (common practice)");
  if ((f === undefined || f < STATIC_BELOW) && b >= PUBLIC_STATIC_FIELD_LIMIT) {
    parts.push(
      b >= STATIC_FIELD_LIMIT.occupational
        ? `it exceeds the ICNIRP 2009 static-field limits for the public (400 mT) and for workers (2 T head and trunk; limbs 8 T)`
        : "it exceeds the ICNIRP 2009 static-field limit for the public (400 mT)",
    );
  }
  return `flux density ${formatFluxDensity(b)}: ${parts.join("; ")}. Reference levels are screening values, not a safety assessment. ${GOVERN}`;
}

// At a known frequency: the public and occupational levels of the ICNIRP 2010 tables there.
function alternatingPart(b: number, f: number): string {
  const at = `at ${formatNumber(f, 3)} Hz`;
  const pub = referenceLevel(f, "public", "fluxDensity");
  const occ = referenceLevel(f, "occupational", "fluxDensity");
  if (pub === undefined || occ === undefined) {
    return `${at}, above the 10 MHz end of the ICNIRP 2010 tables, the radio-frequency guidelines (ICNIRP 2020) apply; the tables' last public level is ${tesla(firstLine(f))}`;
  }
  return b >= occ.value
    ? `${at} it exceeds the ICNIRP 2010 reference levels for the public (${tesla(pub.value)}) and for workers (${tesla(occ.value)})`
    : `${at} it exceeds the ICNIRP 2010 reference level for the public (${tesla(pub.value)}; workers ${tesla(occ.value)})`;
}

// A level as the guideline's readers write it: "200 uT", "1 mT", "27 uT".
function tesla(b: number): string {
  return b >= 1e-3 ? `${formatNumber(b * 1e3, 3)} mT` : `${formatNumber(b * 1e6, 3)} uT`;
}

// In mT where that reads well; in T for huge values, where b * 1e3 could overflow.
function formatFluxDensity(b: number): string {
  return b < 1 ? `${formatNumber(b * 1e3, 3)} mT` : `${formatNumber(b, 3)} T`;
}

// ---- voltages ----

/**
 * Voltage bands of IEC 60449:1973 as used by IEC 61140:2016 (from memory):
 * band I, extra-low voltage, up to 50 V a.c. r.m.s. or 120 V ripple-free d.c.;
 * band II, low voltage, up to 1000 V a.c. or 1500 V d.c.; above that, high voltage.
 */
export const VOLTAGE_BANDS = {
  ac: { extraLow: 50, low: 1000 },
  dc: { extraLow: 120, low: 1500 },
} as const;

/**
 * The voltage rule: `above_extra_low_voltage` for band II (a shock hazard on
 * touchable parts) and `high_voltage` above band II. `volts` picks the voltage
 * (r.m.s. for "ac") from the inputs and result; default |value|.
 */
export function voltageCautions<X>(kind: "ac" | "dc", volts: (x: X, value: Value) => number = (_x, v) => magnitude(v)) {
  const band = VOLTAGE_BANDS[kind];
  const what = kind === "ac" ? "a.c. r.m.s." : "ripple-free d.c.";
  return [
    {
      code: "above_extra_low_voltage",
      when: (x: X, v: Value): boolean => volts(x, v) > band.extraLow && volts(x, v) <= band.low,
      measure: (x: X, v: Value): number => volts(x, v),
      message: (x: X, v: Value): string =>
        `${formatNumber(volts(x, v), 3)} V (${what}) is above the extra-low-voltage band (${band.extraLow} V; IEC 61140, IEC 60449 band I): a shock hazard on touchable parts. ${GOVERN}`,
    },
    {
      code: "high_voltage",
      when: (x: X, v: Value): boolean => volts(x, v) > band.low,
      measure: (x: X, v: Value): number => volts(x, v),
      message: (x: X, v: Value): string =>
        `${formatNumber(volts(x, v), 3)} V (${what}) is high voltage, above ${band.low} V (IEC 61140, IEC 60449 band II upper limit): lethal on contact, and arcs across air gaps; work only under high-voltage procedures. ${GOVERN}`,
    },
  ] as const;
}

// ---- stored energy ----

/**
 * Stored energy counted as a hazardous energy level: 20 J (IEC 60950-1:2005,
 * 1.2.8.10, now superseded by IEC 62368-1; from memory). Below it a discharge
 * can still startle or burn but is not treated as an energy hazard.
 */
export const HAZARDOUS_ENERGY = 20;

// ---- helpers ----

/** |value| of a scalar, or the Euclidean norm of components (scaled: no overflow in the squares). */
export function magnitude(value: Value): number {
  if (typeof value === "number") return Math.abs(value);
  let big = 0;
  for (const v of value) big = Math.max(big, Math.abs(v));
  if (big === 0 || !Number.isFinite(big)) return big;
  let s = 0;
  for (const v of value) s += (v / big) * (v / big);
  return big * Math.sqrt(s);
}
