// Windings, wire and losses. Every formula exported here is found by the registry.
export { wireGaugeDiameter, wireResistance } from "./wire.js";
export { roundWireAcResistanceFactor } from "./ac-resistance.js";
export { dowellAcResistanceFactor, dowellRoundWireAcResistanceFactor } from "./dowell.js";
export { resonantFrequency, lcCharacteristicImpedance, seriesQualityFactor } from "./resonance.js";
export { rogowskiMutualInductance } from "./rogowski.js";
export { temperatureRise } from "./thermal.js";
export { laminationEddyLoss } from "./lamination.js";
export { solenoidInductanceRoundWire } from "./solenoid.js";
export { leakageInductance } from "./leakage.js";
export { areaProduct, inductorAreaProduct, windowFillFactor } from "./area-product.js";
