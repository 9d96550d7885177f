/**
 * Engineering units for chart axes: a prefix chosen from the data, so a gap
 * axis reads 0.1 ... 1 mm and a capacitance axis 1 ... 9 pF, not 1e-4 m and
 * 9e-12 F. Charts show values divided by `factor` next to the unit `label`;
 * the data itself stays in SI.
 */

/** How one axis is shown: displayed value = SI value / factor, titled with `label`. */
export interface AxisUnit {
  /** SI units per displayed unit (1e-3 for mm, 1e-12 for pF). */
  readonly factor: number;
  /** The unit as a person reads it: "mm", "pF/m", "mm²", "kΩ", "×10⁻⁶ kg", "" for plain numbers. */
  readonly label: string;
}

// Engineering prefixes, 10^-15 to 10^12. Outside that range an axis falls back
// to a power of ten in the label, which reads better than an unfamiliar prefix.
const PREFIX: Readonly<Record<number, string>> = { [-15]: "f", [-12]: "p", [-9]: "n", [-6]: "µ", [-3]: "m", 0: "", 3: "k", 6: "M", 9: "G", 12: "T" };

// Symbols that take a prefix in everyday engineering use. The kilogram is left
// out (prefixes go on the gram), and so are K and mol (mK, mmol are rare on a
// chart of this trade): those get the power-of-ten label.
const PREFIXABLE = new Set(["m", "s", "Hz", "A", "V", "ohm", "S", "F", "H", "Wb", "T", "N", "J", "W", "C", "Pa", "rad"]);

const SUPERSCRIPT: Readonly<Record<string, string>> = { "-": "⁻", 0: "⁰", 1: "¹", 2: "²", 3: "³", 4: "⁴", 5: "⁵", 6: "⁶", 7: "⁷", 8: "⁸", 9: "⁹" };

// Number("1e-6") is the double nearest 10^-6; 10 ** -6 need not be.
const pow10 = (n: number): number => Number(`1e${n}`);

const superscript = (n: number): string => [...String(n)].map((c) => SUPERSCRIPT[c] ?? c).join("");

/** "ohm" -> "Ω", "m^2" -> "m²", "V m/s" -> "V·m/s": the unit as printed on an axis. */
export function unitLabel(unit: string): string {
  return unit
    .replace(/ohm/g, "Ω")
    .replace(/\^(-?\d+)/g, (_, p: string) => superscript(Number(p)))
    .replace(/ /g, "·");
}

/**
 * The largest magnitude among finite values (0 when there is none).
 * `use[k]` = 0 leaves a value out (points not computed). One pass, bounded by values.length.
 */
export function largestMagnitude(values: ArrayLike<number>, use?: ArrayLike<number>): number {
  let m = 0;
  for (let k = 0; k < values.length; k++) {
    const a = Math.abs(values[k]!);
    if ((use === undefined || use[k] === 1) && a > m && a - a === 0) m = a;
  }
  return m;
}

/**
 * The axis unit for values up to `largest` in magnitude, given in SI `unit`.
 * The prefix is the largest engineering prefix that keeps the largest value at
 * 1 or more (so 0.1 mm to 1 mm reads in mm, and 100 mm^2 stays 100 mm^2, since a
 * prefix on m^2 scales by its square). Compound units take the prefix on their
 * first symbol (pF/m, kV/m, mA/m²).
 */
export function axisUnit(unit: string, largest: number): AxisUnit {
  const m = /^([A-Za-z]+)(?:\^([23]))?((?:[/ ].*)?)$/.exec(unit);
  const power = m?.[2] ? Number(m[2]) : 1;
  // Decades of the largest value per power of the symbol; 0 and non-finite give no scaling.
  const decades = largest > 0 && largest - largest === 0 ? Math.log10(largest) / power : 0;
  // floor of a log10 can land one low at an exact power of ten (log10(1e-3) is exact
  // in IEEE doubles, but a product of units may not be): a tiny nudge up keeps 1 mm in mm.
  const step = 3 * Math.floor((decades + 1e-12) / 3);
  if (m && PREFIXABLE.has(m[1]!)) {
    const exp = Math.min(12, Math.max(-15, step));
    return { factor: pow10(exp * power), label: unitLabel(`${PREFIX[exp]}${unit}`) };
  }
  // Plain numbers between 0.001 and 10000 read as they are; so do other units in that range.
  if (largest === 0 || (largest >= 1e-3 && largest < 1e4)) return { factor: 1, label: unitLabel(unit) };
  const exp = 3 * Math.floor((Math.log10(largest) + 1e-12) / 3);
  return { factor: pow10(exp), label: `×10${superscript(exp)}${unit ? ` ${unitLabel(unit)}` : ""}` };
}

/** "gap (mm)", or the name alone when the label is empty. */
export function axisTitle(name: string, u: AxisUnit): string {
  return u.label ? `${name} (${u.label})` : name;
}
