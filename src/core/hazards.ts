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
/** Static fields: ICNIRP 2009 exposure limit for the general public, 400 mT (from memory). */
export const PUBLIC_STATIC_FIELD_LIMIT = 0.4;
/**
 * Power-frequency (25-400 Hz) fields: ICNIRP, "Guidelines for limiting exposure
 * to time-varying electric and magnetic fields (1 Hz to 100 kHz)", Health
 * Physics 99(6) (2010) 818-836, Table 4: general-public reference level 200 uT
 * (Table 3: occupational 1 mT for 25-300 Hz) (from memory).
 */
export const PUBLIC_POWER_FREQUENCY_FIELD = 200e-6;
export const OCCUPATIONAL_POWER_FREQUENCY_FIELD = 1e-3;
/** Above about 3 mT loose ferromagnetic parts can be pulled in (MRI site practice; common practice, from memory). */
export const PROJECTILE_FIELD = 3e-3;

/**
 * The one strong-field rule. It fires from the lowest threshold that applies
 * to any waveform (the power-frequency public reference level) and says which
 * thresholds the field passes for a static and for a 50-60 Hz field, since a
 * formula computed from a current does not know whether the current alternates.
 * `flux` picks the flux density (T) from the inputs and result; default |value|.
 */
export function strongFieldCaution<X>(flux: (x: X, value: Value) => number = (_x, v) => magnitude(v)) {
  return {
    code: "strong_field",
    when: (x: X, v: Value): boolean => flux(x, v) >= PUBLIC_POWER_FREQUENCY_FIELD,
    measure: (x: X, v: Value): number => flux(x, v),
    message: (x: X, v: Value): string => strongFieldMessage(flux(x, v)),
  } as const;
}

function strongFieldMessage(b: number): string {
  const parts: string[] = [];
  parts.push(
    b >= OCCUPATIONAL_POWER_FREQUENCY_FIELD
      ? "if it alternates at power frequency (50-60 Hz), it exceeds the ICNIRP 2010 reference levels for the public (200 uT) and for workers (1 mT)"
      : "if it alternates at power frequency (50-60 Hz), it exceeds the ICNIRP 2010 reference level for the public (200 uT; workers 1 mT)",
  );
  if (b >= IMPLANT_STATIC_FIELD) {
    parts.push("as a static field it is at or above the 0.5 mT (5 G) line for pacemakers and other implanted medical devices (ICNIRP 2009 static-field guideline): mark and restrict the area");
  } else {
    parts.push("as a static field it is below the 0.5 mT line for implanted medical devices (ICNIRP 2009)");
  }
  if (b >= PROJECTILE_FIELD) parts.push("loose iron and steel parts can be pulled in (common practice)");
  if (b >= PUBLIC_STATIC_FIELD_LIMIT) parts.push("it exceeds the ICNIRP 2009 static-field limit for the public (400 mT)");
  return `flux density ${formatFluxDensity(b)}: ${parts.join("; ")}. Reference levels are screening values, not a safety assessment. ${GOVERN}`;
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
