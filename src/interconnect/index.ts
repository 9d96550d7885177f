export { microstripImpedance, microstripEffectivePermittivity } from "./microstrip.js";
