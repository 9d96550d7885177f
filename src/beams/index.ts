export { lorentzFactor, particleSpeed, particleMomentum, magneticRigidity, bendingRadius, quadrupoleFocalLength } from "./kinematics.js";
export { childLangmuirCurrentDensity, plasmaFrequency, debyeLength, perveance } from "./space-charge.js";
