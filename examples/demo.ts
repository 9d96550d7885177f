/**
 * A design worked through emquant, for an invented product: a benchtop dosing
 * pump with a small buck converter, a capacitive level probe in its reservoir
 * and a voice-coil pinch valve. Every number below is made up for the example;
 * material values are typical catalogue-style figures, not data for a real part.
 *
 * Run: npm run demo   (writes the sweep to out/demo/: CSV, the chart specification and the chart as SVG;
 * and the design reports to out/designs/)
 */
import { mkdirSync, readFileSync, writeFileSync } from "node:fs";
import {
  capacitorEnergy, coaxialCapacitance, coreFluxDensity, coreLoss, evaluate, gappedCoreInductance,
  inUnit, parasiticCouplingCurrent, quantity, skinDepth, solveDetails, sweep, sweepToCsv,
  sweepToVegaLite, tolerance, wireForce, formatQuantity, gappedCorePullForce, type Note,
  designReportHtml, designReportMarkdown, designTolerance, evaluateDesign, solveDesign, sweepDesign, type DesignSpec,
  microstripImpedance, microstripEffectivePermittivity, propagationDelay, viaInductance, traceResistance, reflectionCoefficient,
  nearEndCrosstalk, coupledMicrostripImpedance, traceCurrentForTemperatureRise, type Length,
  dowellRoundWireAcResistanceFactor, roundWireAcResistanceFactor, temperatureRise, wireGaugeDiameter, wireResistance,
} from "../src/index.js";
import { gappedInductor } from "./designs/gapped-inductor.js";
// The chart renderer of the emquant command (vega and vega-lite, loaded on first use).
import { vegaLiteToSvg } from "../src/cli/chart.js";

const show = (label: string, value: number, unit: string): void =>
  console.log(`  ${label.padEnd(38)} ${formatQuantity(value, unit)}`);
const notes = (warnings: readonly Note[], cautions: readonly Note[]): void => {
  for (const w of warnings) console.log(`    warning [${w.code}]: ${w.message}`);
  for (const c of cautions) console.log(`    CAUTION [${c.code}]: ${c.message}`);
};

console.log("emquant demo: an invented benchtop dosing pump\n");

// ---------------------------------------------------------------------------
console.log("1. Output inductor of the 24 V -> 5 V buck converter (gapped ferrite core)");
// Effective core parameters as a datasheet gives them (IEC 60205 style); invented.
const core = {
  pathLength: quantity(35, "mm"),
  area: quantity(30, "mm^2"),
  relativePermeability: 2000,
};
const target = quantity(22, "uH");
const gap = solveDetails(gappedCoreInductance, "gapLength", { ...core, turns: 14, target });
show("gap for 22 uH with 14 turns", gap.value, gap.unit);
const gapLength = quantity(Number(gap.value.toPrecision(2)), "m"); // rounded to a grindable gap
const inductance = gappedCoreInductance({ ...core, turns: 14, gapLength });
show("inductance with the rounded gap", inductance, "H");
const turns = solveDetails(gappedCoreInductance, "turns", { ...core, gapLength, target: quantity(25, "uH") });
console.log(`  turns for at least 25 uH: ${turns.value} (exact solution ${turns.exact?.toFixed(2)}, gives ${formatQuantity(turns.outputAtValue, "H")})`);
const peak = coreFluxDensity.details({
  ...core, turns: 14, gapLength, current: quantity(3.2, "A"), saturationFluxDensity: quantity(0.35, "T"),
});
show("peak flux density at 3.2 A", peak.value, "T");
notes(peak.warnings, peak.cautions);
const delta = skinDepth({ conductivity: quantity(58, "MS/m"), frequency: quantity(400, "kHz"), relativePermeability: 1 });
show("copper skin depth at 400 kHz", delta, "m");
// Steinmetz coefficients invented for the example, in W/m^3 with f in Hz and B in T.
const loss = coreLoss.details({
  coefficient: 1.5, frequencyExponent: 1.4, fluxExponent: 2.5,
  frequency: quantity(400, "kHz"), peakFluxDensity: quantity(0.05, "T"), volume: quantity(1.05, "cm^3"),
});
show("core loss at 50 mT ripple", loss.value, "W");
notes(loss.warnings, loss.cautions);

// ---------------------------------------------------------------------------
console.log("\n2. Capacitive level probe: a rod inside a tube, the liquid as dielectric");
// Through evaluate(), as a backend would receive it: unit strings in, SI out.
const probe = { innerRadius: "3 mm", outerRadius: "9 mm", length: "150 mm" };
const empty = evaluate("coaxialCapacitance", { ...probe, relativePermittivity: 1 });
const full = evaluate("coaxialCapacitance", { ...probe, relativePermittivity: 80 });
show("probe capacitance, empty (air)", empty.value as number, empty.unit);
show("probe capacitance, full (water, er 80)", full.value as number, full.unit);
notes(full.warnings, full.cautions);
const tol = tolerance(coaxialCapacitance, {
  innerRadius: { nominal: "3 mm", plusMinus: "0.05 mm" },
  outerRadius: { nominal: "9 mm", plusMinus: "0.1 mm" },
  length: { nominal: "150 mm", percent: 1 },
  relativePermittivity: 1,
}, { samples: 20000, seed: 7 });
show("empty capacitance, worst case low", tol.worstCase.min, tol.unit);
show("empty capacitance, worst case high", tol.worstCase.max, tol.unit);
show("Monte Carlo 1st percentile", tol.monteCarlo!.p1, tol.unit);
show("Monte Carlo 99th percentile", tol.monteCarlo!.p99, tol.unit);
const top = [...tol.sensitivities].sort((a, b) => b.share - a.share)[0]!;
console.log(`  dominant tolerance: ${top.input} (${(100 * top.share).toFixed(0)} % of the variance)`);
// Stray capacitance from the converter's switch node to the probe electrode.
const stray = parasiticCouplingCurrent.details({ capacitance: quantity(0.5, "pF"), voltageSlewRate: quantity(2, "V/ns") });
show("switch-node current through 0.5 pF", stray.value, "A");
notes(stray.warnings, stray.cautions);

// Sweep the probe against the liquid's permittivity and write CSV + chart spec.
const s = sweep(coaxialCapacitance, {
  vary: { relativePermittivity: { from: 1, to: 80, points: 40, scale: "log" } },
  fixed: { innerRadius: 3e-3, outerRadius: 9e-3, length: 0.15 },
});
mkdirSync("out/demo", { recursive: true });
writeFileSync("out/demo/probe-sweep.csv", sweepToCsv(s));
const chart = sweepToVegaLite(s);
writeFileSync("out/demo/probe-sweep.vl.json", JSON.stringify(chart, null, 2));
writeFileSync("out/demo/probe-sweep.svg", await vegaLiteToSvg(chart));
console.log(`  sweep of ${s.axes[0]!.values.length} points written to out/demo/probe-sweep.csv, .vl.json and .svg`);

// ---------------------------------------------------------------------------
console.log("\n3. Voice-coil pinch valve");
const coil = { length: quantity(4.2, "m"), fluxDensity: quantity(0.9, "T") }; // wire in the gap field
const force = wireForce.details({ ...coil, current: quantity(0.8, "A") });
show("force at 0.8 A", force.value, "N");
notes(force.warnings, force.cautions);
const needed = solveDetails(wireForce, "current", { ...coil, target: quantity(5, "N") });
show("current for 5 N closing force", needed.value, needed.unit);

// ---------------------------------------------------------------------------
console.log("\n4. Hold-up capacitor on the 24 V rail");
const hold = capacitorEnergy.details({ capacitance: quantity(2200, "uF"), voltage: quantity(24, "V") });
show("stored energy, 2200 uF at 24 V", hold.value, "J");
notes(hold.warnings, hold.cautions);
const bank = capacitorEnergy.details({ capacitance: quantity(470, "uF"), voltage: quantity(400, "V") });
show("the PFC bulk capacitor, 470 uF at 400 V", bank.value, "J");
notes(bank.warnings, bank.cautions);
console.log(`\n  hold-up capacitor in nF, via inUnit: ${inUnit(quantity(2200, "uF"), "nF").toFixed(1)} nF`);

console.log("\n5. Solenoid latch for the reservoir lid: pull against the gap");
// An invented latch: a 600-turn coil on a small steel frame, plunger face 1.2 cm^2,
// 6 cm of iron path (mu_r 1500 assumed linear), driven at 0.6 A from the 24 V rail.
const latch = { turns: 600, current: quantity(0.6, "A"), poleArea: quantity(1.2, "cm^2"), pathLength: quantity(6, "cm"), relativePermeability: 1500 };
for (const mm of [3, 2, 1, 0.5, 0.2]) {
  const pull = gappedCorePullForce.details({ ...latch, gapLength: quantity(mm, "mm") });
  show(`pull at a ${mm} mm gap`, pull.value, "N");
  notes(pull.warnings, pull.cautions);
}
// The pull rises as 1/(gap + l/mu_r)^2: the latch snaps shut, and the last fraction of a
// millimetre is where fingers get caught. The holding current can be far lower than the pull-in current.
const hold05 = solveDetails(gappedCorePullForce, "current", { ...latch, gapLength: quantity(0.2, "mm"), target: quantity(5, "N") }, { range: [quantity(1, "mA"), quantity(1, "A")] });
show("holding current for 5 N at 0.2 mm", hold05.value, hold05.unit);

// ---------------------------------------------------------------------------
console.log("\n6. Level-probe sensor board: the 20 MHz excitation line and its via (4-layer board, invented stack-up)");
// Outer layer over 0.2 mm of prepreg (epsr 4.2) to the ground plane; 35 um copper.
const stack = { height: quantity(0.2, "mm"), relativePermittivity: 4.2, thickness: quantity(35, "um") };
const width = solveDetails(microstripImpedance, "width", { ...stack, target: quantity(50, "ohm") });
show("trace width for 50 ohm", width.value, width.unit);
const line = { ...stack, width: width.value as Length };
const eeff = microstripEffectivePermittivity.details({ ...line, frequency: quantity(20, "MHz") });
show("effective permittivity at 20 MHz", eeff.value, "");
notes(eeff.warnings, eeff.cautions);
const run = propagationDelay({ length: quantity(60, "mm"), effectivePermittivity: eeff.value });
show("delay over the 60 mm run", run, "s");
show("via to the inner ground (1.6 mm, 0.3 mm drill)", viaInductance({ height: quantity(1.6, "mm"), radius: quantity(0.15, "mm") }), "H");
show("trace resistance at 60 degC", evaluate("traceResistance", { length: "60 mm", width: `${(width.value as number) * 1e3} mm`, thickness: "35 um", temperature: "60 degC" }).value as number, "ohm");
// The board's 1 mm supply trace: what it carries for a 10 K rise by the IPC-2221 fit (IPC-2152's charts supersede it).
const supply = traceCurrentForTemperatureRise.details({ width: quantity(1, "mm"), thickness: quantity(35, "um"), temperatureRise: quantity(10, "K") });
show("supply trace current for a 10 K rise", supply.value, "A");
notes(supply.warnings, supply.cautions);
show("reflection at the 75 ohm cable to the probe", reflectionCoefficient({ loadResistance: quantity(75, "ohm"), characteristicImpedance: quantity(50, "ohm") }), "");
// The guard trace beside it, 0.2 mm away: even/odd modes and the near-end crosstalk they imply.
const pair = { width: line.width, spacing: quantity(0.2, "mm"), height: stack.height, relativePermittivity: 4.2 };
const next = nearEndCrosstalk({
  evenImpedance: coupledMicrostripImpedance({ ...pair, mode: "even" }),
  oddImpedance: coupledMicrostripImpedance({ ...pair, mode: "odd" }),
});
show("near-end crosstalk into the guard trace", next, "");

// ---------------------------------------------------------------------------
console.log("\n7. Loss budget of the buck output inductor from section 1");
// Invented winding: 14 turns of AWG 20 copper in two layers, 30 mm mean turn, pitch 0.9 mm;
// 3 A DC with 0.8 A peak-to-peak triangular ripple at 400 kHz; winding assumed at 100 degC.
const wire = wireGaugeDiameter({ gauge: "20" });
show("AWG 20 bare diameter", wire, "m");
const winding = wireResistance.details({ length: quantity(14 * 30, "mm"), diameter: wire, temperature: quantity(373.15, "K") });
show("DC resistance at 100 degC", winding.value, "ohm");
notes(winding.warnings, winding.cautions);
const skinOnly = roundWireAcResistanceFactor({ diameter: wire, frequency: quantity(400, "kHz") });
const layered = dowellRoundWireAcResistanceFactor.details({ layers: 2, wireDiameter: wire, pitch: quantity(0.9, "mm"), frequency: quantity(400, "kHz") });
console.log(`  R_ac/R_dc at 400 kHz: ${skinOnly.toFixed(3)} for an isolated wire, ${layered.value.toFixed(3)} in two layers (Dowell)`);
notes(layered.warnings, layered.cautions);
const dcCurrent = 3, rippleRms = 0.8 / (2 * Math.sqrt(3)); // triangle ripple: peak-to-peak / (2 sqrt 3)
// The ripple's harmonics are lumped at the fundamental here: a first estimate only.
const copperDc = dcCurrent ** 2 * winding.value;
const copperAc = rippleRms ** 2 * winding.value * layered.value;
const budget = [
  ["copper, DC", copperDc],
  ["copper, ripple at 400 kHz", copperAc],
  ["core (Steinmetz, section 1)", loss.value],
] as const;
const total = budget.reduce((sum, [, p]) => sum + p, 0);
for (const [label, p] of budget) show(label, p, "W");
show("total loss", total, "W");
// Invented surface area of the wound core, 12 cm^2.
const rise = temperatureRise.details({ loss: quantity(total, "W"), surfaceArea: quantity(12, "cm^2") });
show("temperature rise in still air (McLyman)", rise.value, "K");
notes(rise.warnings, rise.cautions);
console.log("  Estimates for a design review, not a qualification: measure the hottest spot on a prototype.");

// ---------------------------------------------------------------------------
console.log("\n8. Designs: whole chains with checks, tolerance and a calculation report");
// Two designs of our own, as JSON files (a backend would receive these) and, for
// the inductor, as typed TypeScript (examples/designs/gapped-inductor.ts).
mkdirSync("out/designs", { recursive: true });
for (const name of ["gapped-inductor", "level-sensor"]) {
  const spec = JSON.parse(readFileSync(`examples/designs/${name}.json`, "utf8")) as DesignSpec;
  const result = evaluateDesign(spec);
  const spread = designTolerance(spec, { samples: 5000 });
  console.log(`  ${result.title}`);
  for (const k of result.checks) {
    const failing = spread.checks.find((c) => c.rule === k.rule)!.failureProbability!;
    console.log(`    ${k.pass ? "pass" : "FAIL"}  ${k.rule.padEnd(28)} margin ${formatQuantity(k.margin, k.unit)}; fails in ${(failing * 100).toFixed(1)} % of toleranced builds`);
  }
  // A sweep for each report: the inductor's flux density over the load current, the probe's capacitance over the level.
  const plan = name === "gapped-inductor"
    ? { input: "peakCurrent", from: "3 A", to: "9 A", output: "peakFluxDensity" }
    : { input: "level", from: "0.05 m", to: "0.95 m", output: "probeCapacitance" };
  const sweeps = [{ sweep: sweepDesign(spec, { ...plan, points: 31 }), output: plan.output }];
  writeFileSync(`out/designs/${name}.html`, designReportHtml(result, { tolerance: spread, sweeps }));
  writeFileSync(`out/designs/${name}.md`, designReportMarkdown(result, { tolerance: spread, sweeps }));
}
const typed = gappedInductor.evaluate();
show("typed design: inductance", typed.values.inductance, "H");
const turnsFor = solveDesign(gappedInductor, { input: "turns", output: "inductance", target: "60 uH" });
show(`turns for 60 uH (whole turns: ${turnsFor.value})`, turnsFor.achieved, "H");
console.log("  reports written to out/designs/*.html and *.md");
