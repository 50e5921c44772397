// Form factor from a test log: logged speed and electrical power against the resistance model.
//   P_elec(V) = ((1+k)·R_F(V) + ½ρV²·C_D·A)·V / η
// is linear in (1+k), so the least-squares value in electrical power has a closed form. Pure.
import { waterProperties } from './properties/water';
import { hullResistance, type HullInput } from './resistance';

export interface PowerPoint {
  speed_mps: number;
  power_W: number;
}

export interface FormFactorFit {
  formFactor: number;
  /** 1 − SS_res/SS_tot of electrical power; null when every logged power is the same */
  rSquared: number | null;
  residuals: { speed_mps: number; power_W: number; predicted_W: number; residual_W: number }[];
}

/** Electrical power the model predicts at speed V for a given form factor and drivetrain efficiency. */
function predictedPower(hull: HullInput, V: number, efficiency: number): { friction_W: number; rest_W: number } {
  const w = waterProperties(hull.temperature_C, hull.water);
  const r = hullResistance(hull, V, w.density_kgm3, w.kinematicViscosity_m2s);
  return { friction_W: (r.frictional_N * V) / efficiency, rest_W: (r.appendage_N * V) / efficiency };
}

export function fitFormFactor(hull: HullInput, points: PowerPoint[], efficiency: number): FormFactorFit {
  const parts = points.map((p) => predictedPower(hull, p.speed_mps, efficiency));
  let sxy = 0;
  let sxx = 0;
  points.forEach((p, i) => {
    sxy += parts[i].friction_W * (p.power_W - parts[i].rest_W);
    sxx += parts[i].friction_W ** 2;
  });
  const formFactor = sxy / sxx;
  const residuals = points.map((p, i) => {
    const predicted = formFactor * parts[i].friction_W + parts[i].rest_W;
    return { speed_mps: p.speed_mps, power_W: p.power_W, predicted_W: predicted, residual_W: p.power_W - predicted };
  });
  const mean = points.reduce((a, p) => a + p.power_W, 0) / points.length;
  const ssTot = points.reduce((a, p) => a + (p.power_W - mean) ** 2, 0);
  const ssRes = residuals.reduce((a, r) => a + r.residual_W ** 2, 0);
  return { formFactor, rSquared: ssTot > 0 ? 1 - ssRes / ssTot : null, residuals };
}
