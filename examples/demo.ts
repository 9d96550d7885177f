/**
 * A design worked through emquant, for an invented product: a benchtop dosing
 * pump with a small buck converter, a capacitive level probe in its reservoir
 * and a voice-coil pinch valve. Every number below is made up for the example;
 * material values are typical catalogue-style figures, not data for a real part.
 *
 * Run: npm run demo   (writes the sweep to out/demo/)
 */
import { mkdirSync, writeFileSync } from "node:fs";
import {
  capacitorEnergy, coaxialCapacitance, coreFluxDensity, coreLoss, evaluate, gappedCoreInductance,
  inUnit, parasiticCouplingCurrent, quantity, skinDepth, solveDetails, sweep, sweepToCsv,
  sweepToVegaLite, tolerance, wireForce, formatQuantity, type Note,
  dowellRoundWireAcResistanceFactor, roundWireAcResistanceFactor, temperatureRise, wireGaugeDiameter, wireResistance,
} from "../src/index.js";

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
writeFileSync("out/demo/probe-sweep.vl.json", JSON.stringify(sweepToVegaLite(s), null, 2));
console.log(`  sweep of ${s.axes[0]!.values.length} points written to out/demo/probe-sweep.csv and .vl.json`);

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

// ---------------------------------------------------------------------------
console.log("\n5. Loss budget of the buck output inductor from section 1");
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
