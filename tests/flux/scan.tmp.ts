import { loopField } from "../../src/index.js";
import { loopFieldOracle } from "./oracle.js";
let worst = 0, at = "";
const rnd = (lo: number, hi: number) => Math.exp(Math.log(lo) + Math.random() * (Math.log(hi) - Math.log(lo)));
for (let i = 0; i < 6000; i++) {
  const kind = i % 3;
  let rho: number, z: number;
  if (kind === 0) { rho = rnd(1e-6, 1e4); z = (Math.random() < 0.5 ? -1 : 1) * rnd(1e-6, 1e4); }
  else if (kind === 1) { const d = rnd(1e-9, 1e-1), t = Math.random() * 2 * Math.PI; rho = 1 + d * Math.cos(t); z = d * Math.sin(t); }
  else { rho = Math.random() * 3; z = (Math.random() - 0.5) * 3; }
  const [er, ez] = loopFieldOracle(1, 1, rho, z);
  const [br, bz] = loopField({ current: 1 as any, radius: 1 as any, radialDistance: rho as any, axialDistance: z as any });
  const s = Math.hypot(er, ez);
  const err = Math.max(Math.abs(br! - er), Math.abs(bz! - ez)) / s;
  if (err > worst) { worst = err; at = `${rho} ${z}`; }
}
console.log(worst, at);
const t0 = performance.now(); let acc = 0;
for (let i = 0; i < 200000; i++) { const v = loopField({ current: 1 as any, radius: 1 as any, radialDistance: (i % 300) / 100 as any, axialDistance: 0.3 as any }); acc += v[1]!; }
console.log("ns/call", (performance.now() - t0) / 200000 * 1e6, acc > 0);
