// Writes tests/force/fixtures/coils-oracle.json, the decimal oracles' values for every coil
// case of tests/force/coils-offset.test.ts and coils-accuracy.test.ts (tests/force/coils-cases.ts),
// so the tests need not spend a minute of quadrature in decimal each run:
//
//   npx tsx tests/force/make-coils-fixture.ts
//
// Rerun it after changing a case, an oracle or its settings. While writing, it asserts the
// oracle-against-oracle checks the tests keep only in part live: the window oracle against the
// filament oracle, the filament oracle against the double integral of Babic and Akyel's force as
// written, and the filament oracle against itself at other settings.
import { writeFileSync } from "node:fs";
import { coilsAttractionOracle, coilsDoubleIntegral } from "./coils-oracle.js";
import { offsetAttractionOracle } from "./coils-offset-oracle.js";
import {
  CONVERGENCE_CASES, CONVERGENCE_SETTINGS, FLAT_CASES, LEADING_CASES, OFFSET_CASES, REDUCTION_CASES, REGION_CASES, WINDOW_VS_DOUBLE,
  type CoilsAt,
} from "./coils-cases.js";
import { caseKey, FIXTURE_URL, type CoilsFixture, type FixtureSection, type OracleSection } from "./coils-fixture.js";
import type { Dec } from "../math/decimal-elliptic.js";

const DIGITS = 40;

function section(oracle: string, formula: string, settings: string, cases: readonly CoilsAt[], value: (c: CoilsAt) => Dec): { s: OracleSection; values: Map<string, Dec> } {
  const seen = new Set<string>();
  const entries: [string, string, string, string, string, string][] = [];
  const values = new Map<string, Dec>();
  for (const c of cases) {
    const key = caseKey(c);
    if (seen.has(key)) continue;
    seen.add(key);
    const start = performance.now();
    const g = value(c);
    values.set(key, g);
    entries.push([...c.map((v) => String(v)), g.toSignificantDigits(DIGITS).toExponential()] as [string, string, string, string, string, string]);
    console.log(`${oracle} ${key}: ${((performance.now() - start) / 1000).toFixed(2)} s`);
  }
  return { s: { oracle, formula, settings, entries }, values };
}

const relative = (x: Dec, y: Dec): number => x.minus(y).div(y).abs().toNumber();

const window = section(
  "offsetAttractionOracle (tests/force/coils-offset-oracle.ts)",
  "G l1 l2 = int_{c-d}^{c+d} m0(u) du - int_{s-d}^{s+d} m0(u) du, c = |h1 - h2|, s = h1 + h2, m0 Maxwell's M0 / mu0 (Treatise (1873), art. 701)",
  "40 Gauss-Legendre points a panel graded by 1/4 towards u = 0, tanh-sinh at a log singularity, 40 digits plus the losses (digitsFor)",
  [...OFFSET_CASES, ...FLAT_CASES, ...LEADING_CASES, ...WINDOW_VS_DOUBLE], (c) => offsetAttractionOracle(...c));
const filament = section(
  "coilsAttractionOracle (tests/force/coils-oracle.ts)",
  "G = int_{d-h2}^{d+h2} [m0(z - h1) - m0(z + h1)] dz, the double integral of Babic and Akyel's (2008) filament force, inner integral exact",
  "default: 24 + 1.05 log10(span / d) Gauss-Legendre points a panel graded by 1/4, tanh-sinh step 1/16, digits for the cancellation",
  [...REGION_CASES, ...WINDOW_VS_DOUBLE, ...CONVERGENCE_CASES, ...REDUCTION_CASES], (c) => coilsAttractionOracle(...c));
const filamentOther = section(
  "coilsAttractionOracle (tests/force/coils-oracle.ts), other settings",
  "as filament",
  `order ${CONVERGENCE_SETTINGS.order}, grade ${CONVERGENCE_SETTINGS.grade}, step ${CONVERGENCE_SETTINGS.step}, ${CONVERGENCE_SETTINGS.extraDigits} extra digits`,
  CONVERGENCE_CASES, (c) => coilsAttractionOracle(...c, CONVERGENCE_SETTINGS));
const doubleIntegral = section(
  "coilsDoubleIntegral (tests/force/coils-oracle.ts)",
  "the double integral of Babic and Akyel's (2008) filament force as written, n x n Gauss-Legendre, separated coils",
  "n = 24, 50 digits",
  REDUCTION_CASES, (c) => coilsDoubleIntegral(...c));

// The checks the tests keep only in part live, asserted here on every case.
const failures: string[] = [];
for (const c of WINDOW_VS_DOUBLE) {
  const e = relative(window.values.get(caseKey(c))!, filament.values.get(caseKey(c))!);
  if (!(e < 1e-22)) failures.push(`window vs filament ${caseKey(c)}: ${e}`);
}
for (const c of CONVERGENCE_CASES) {
  const e = relative(filamentOther.values.get(caseKey(c))!, filament.values.get(caseKey(c))!);
  if (!(e < 1e-20)) failures.push(`filament at other settings ${caseKey(c)}: ${e}`);
}
for (const c of REDUCTION_CASES) {
  const e = relative(doubleIntegral.values.get(caseKey(c))!, filament.values.get(caseKey(c))!);
  if (!(e < 1e-15)) failures.push(`double integral vs filament ${caseKey(c)}: ${e}`);
}
if (failures.length > 0) throw new Error(`the oracles disagree, fixture not written:\n${failures.join("\n")}`);

const fixture: CoilsFixture = {
  about: "Values of the decimal.js coil-force oracles for the cases of tests/force/coils-cases.ts, written by npx tsx tests/force/make-coils-fixture.ts. Each value is the returned attraction in m (-dM/dd / (mu0 N1 N2), positive = attraction): the force in N is mu0 N1 N2 I1 I2 times it.",
  digits: DIGITS,
  sections: { window: window.s, filament: filament.s, filamentOther: filamentOther.s, doubleIntegral: doubleIntegral.s } satisfies Record<FixtureSection, OracleSection>,
};
// One entry a line, so a changed value shows as one changed line.
writeFileSync(FIXTURE_URL, `${JSON.stringify(fixture, (key, v: unknown) => (key === "entries" ? (v as unknown[]).map((e) => JSON.stringify(e)) : v), 1)
  .replace(/"(\[.*\])"/g, (_, e: string) => e.replace(/\\"/g, '"'))}\n`);
console.log(`wrote ${FIXTURE_URL.pathname}`);
