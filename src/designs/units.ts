import { DIMENSIONS, type DimensionName, type Exponents, describeExponents } from "../units/dimensions.js";
import { sameDimension } from "./expression.js";

/** The coherent SI unit of a dimension (by name or exponents): "H", "V/m", or base units for unnamed ones. */
export function unitOf(d: DimensionName | string | Exponents): string {
  if (typeof d === "string") return (DIMENSIONS as Record<string, { unit: string }>)[d]?.unit ?? "";
  for (const dim of Object.values(DIMENSIONS)) if (sameDimension(dim.exps as Exponents, d)) return dim.unit;
  const text = describeExponents(d.map((x) => +x.toPrecision(12)) as unknown as Exponents);
  return text === "dimensionless" ? "" : text;
}
