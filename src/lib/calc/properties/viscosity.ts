// Dynamic viscosity of ordinary water, IAPWS 2008.
// Source: IAPWS R12-08, "Release on the IAPWS Formulation 2008 for the Viscosity of Ordinary Water Substance";
// M.L. Huber et al. (2009), J. Phys. Chem. Ref. Data 38(2), 101–125, Eqs. 10–12 and Tables 1–2.
// The critical enhancement μ̄2 is 1 outside 645.91 K < T < 650.77 K, so it is omitted here.

const T_STAR = 647.096; // K
const RHO_STAR = 322; // kg/m³
const MU_STAR = 1e-6; // Pa·s

const H0 = [1.67752, 2.20462, 0.6366564, -0.241605];

// H1[i][j] for (1/T̄ − 1)^i (ρ̄ − 1)^j
const H1: number[][] = [
  [5.20094e-1, 2.22531e-1, -2.81378e-1, 1.61913e-1, -3.25372e-2, 0, 0],
  [8.50895e-2, 9.99115e-1, -9.06851e-1, 2.57399e-1, 0, 0, 0],
  [-1.08374, 1.88797, -7.72479e-1, 0, 0, 0, 0],
  [-2.89555e-1, 1.26613, -4.89837e-1, 0, 6.98452e-2, 0, -4.35673e-3],
  [0, 0, -2.5704e-1, 0, 0, 8.72102e-3, 0],
  [0, 1.20573e-1, 0, 0, 0, 0, -5.93264e-4],
];

/** μ (Pa·s) from T (K) and ρ (kg/m³). */
export function waterViscosity(T: number, rho: number): number {
  const Tb = T / T_STAR;
  const rb = rho / RHO_STAR;
  let den = 0;
  for (let i = 0; i < 4; i++) den += H0[i] / Tb ** i;
  const mu0 = (100 * Math.sqrt(Tb)) / den;
  const x = 1 / Tb - 1;
  const y = rb - 1;
  let sum = 0;
  for (let i = 0; i < 6; i++) {
    let inner = 0;
    for (let j = 0; j < 7; j++) inner += H1[i][j] * y ** j;
    sum += x ** i * inner;
  }
  const mu1 = Math.exp(rb * sum);
  return mu0 * mu1 * MU_STAR;
}
