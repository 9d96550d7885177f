import { parseQuantity } from "./src/units/parse.js";
for (const s of ["1e18 1/m^3", "2 1/H", "3 1 / cm^3", "11/m", "1 /m"]) {
  try { const q = parseQuantity(s); console.log(JSON.stringify(s), q.si, q.exps.join(","), q.plain); }
  catch (e) { console.log(JSON.stringify(s), "ERR", (e as any).code, (e as Error).message); }
}
import { codata2022, codata2018 } from "./src/constants/codata.js";
import { constantDecimal } from "./src/constants/decimal.js";
import Decimal from "decimal.js";
const D = Decimal.clone({ precision: 40 });
for (const t of [codata2022, codata2018]) {
  const mu0 = constantDecimal(t.vacuumPermeability, D), c = constantDecimal(t.speedOfLight, D);
  console.log(D.div(1, mu0.times(c.pow(2))).toString(), t.vacuumPermittivity.decimal, mu0.times(c).toString(), t.vacuumImpedance.decimal);
  console.log(constantDecimal(t.elementaryCharge, D).div(constantDecimal(t.electronMass, D)).neg().toString(), t.electronChargeToMassQuotient.decimal);
  for (const r of Object.values(t)) console.log(r.key, r.value, r.relativeUncertainty.toPrecision(2));
}
