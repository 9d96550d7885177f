// Public names of the constants module. The decimal.js helpers (./decimal.ts)
// are left out on purpose so that importing the package root never loads
// decimal.js; they are reachable as a separate entry point.
export * from "./si.js";
export {
  CODATA_EDITIONS, CODATA_KEYS, CODATA_REFERENCES, codata2018, codata2022, constant,
} from "./codata.js";
export type { CodataEdition, CodataKey, CodataRecord } from "./codata.js";
export {
  PARTICLES, alphaParticle, deuteron, electron, muon, neutron, positron, proton,
} from "./particles.js";
export type { Particle, ParticleKey } from "./particles.js";
