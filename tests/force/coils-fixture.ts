// The committed values of the coil-force oracles (tests/force/fixtures/coils-oracle.json),
// written by tests/force/make-coils-fixture.ts. The tests compare the library with these
// values for every case and recompute a few of them live, so a stale or edited file fails.
import { readFileSync } from "node:fs";
import { dec, type Dec } from "../math/decimal-elliptic.js";
import type { CoilsAt } from "./coils-cases.js";

/** One oracle's values: inputs as the shortest decimal strings that read back as the same doubles. */
export interface OracleSection {
  readonly oracle: string;
  readonly formula: string;
  readonly settings: string;
  /** [a, l1, b, l2, d] in m, and G in m (positive = attraction) to `digits` significant digits. */
  readonly entries: readonly (readonly [a: string, l1: string, b: string, l2: string, d: string, g: string])[];
}
export interface CoilsFixture {
  readonly about: string;
  readonly digits: number;
  readonly sections: Readonly<Record<FixtureSection, OracleSection>>;
}
export type FixtureSection = "window" | "filament" | "filamentOther" | "doubleIntegral";

export const FIXTURE_URL = new URL("./fixtures/coils-oracle.json", import.meta.url);
/** A case's key: its doubles, each written so that Number() reads back the same double. */
export const caseKey = (c: CoilsAt): string => c.map((v) => String(v)).join(" ");

let loaded: Map<FixtureSection, Map<string, string>> | undefined;

/** The stored oracle value G for a case; throws if the fixture lacks it (rerun the script). */
export function storedAttraction(section: FixtureSection, c: CoilsAt): Dec {
  if (!loaded) {
    const fixture = JSON.parse(readFileSync(FIXTURE_URL, "utf8")) as CoilsFixture;
    loaded = new Map(Object.entries(fixture.sections).map(([name, s]) =>
      [name as FixtureSection, new Map(s.entries.map((e) => [e.slice(0, 5).map((v) => String(Number(v))).join(" "), e[5]]))]));
  }
  const g = loaded.get(section)?.get(caseKey(c));
  if (g === undefined) throw new Error(`tests/force/fixtures/coils-oracle.json has no ${section} value for ${caseKey(c)}: run npx tsx tests/force/make-coils-fixture.ts`);
  return new (dec(60))(g);
}
