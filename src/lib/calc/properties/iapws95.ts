// IAPWS-95 Helmholtz formulation for ordinary water, liquid region near ambient pressure.
// Source: IAPWS R6-95(2018), "Revised Release on the IAPWS Formulation 1995 for the Thermodynamic
// Properties of Ordinary Water Substance for General and Scientific Use"; W. Wagner & A. Pruß (2002),
// J. Phys. Chem. Ref. Data 31(2), 387–535, Tables 1 and 2 (coefficients transcribed term by term).
// Terms 55–56 (non-analytic, critical region) carry exp(−D(τ−1)²) with D ≥ 700; below 100 °C that factor
// is < 1e-300, i.e. exactly zero in double precision, so they are left out.

export const TC = 647.096; // K
export const RHOC = 322; // kg/m³
export const R_SPECIFIC = 461.51805; // J/(kg·K)

// Terms 1–7: n δ^d τ^t
const P_N = [
  0.12533547935523e-1, 0.78957634722828e1, -0.87803203303561e1, 0.31802509345418, -0.26145533859358,
  -0.78199751687981e-2, 0.88089493102134e-2,
];
const P_D = [1, 1, 1, 2, 2, 3, 4];
const P_T = [-0.5, 0.875, 1, 0.5, 0.75, 0.375, 1];

// Terms 8–51: n δ^d τ^t exp(−δ^c)
const E_N = [
  -0.66856572307965, 0.20433810950965, -0.66212605039687e-4, -0.19232721156002, -0.25709043003438, 0.16074868486251,
  -0.40092828925807e-1, 0.39343422603254e-6, -0.75941377088144e-5, 0.56250979351888e-3, -0.15608652257135e-4,
  0.11537996422951e-8, 0.36582165144204e-6, -0.13251180074668e-11, -0.62639586912454e-9, -0.10793600908932,
  0.17611491008752e-1, 0.22132295167546, -0.40247669763528, 0.58083399985759, 0.49969146990806e-2, -0.31358700712549e-1,
  -0.74315929710341, 0.4780732991548, 0.20527940895948e-1, -0.13636435110343, 0.14180634400617e-1, 0.83326504880713e-2,
  -0.29052336009585e-1, 0.38615085574206e-1, -0.20393486513704e-1, -0.16554050063734e-2, 0.19955571979541e-2,
  0.15870308324157e-3, -0.1638856834253e-4, 0.43613615723811e-1, 0.34994005463765e-1, -0.76788197844621e-1,
  0.22446277332006e-1, -0.62689710414685e-4, -0.55711118565645e-9, -0.19905718354408, 0.31777497330738,
  -0.11841182425981,
];
const E_C = [
  1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 2, 2, 2, 2, 2, 2, 2, 2, 2, 2, 2, 2, 2, 2, 2, 2, 2, 2, 2, 2, 3, 3, 3, 3,
  4, 6, 6, 6, 6,
];
const E_D = [
  1, 1, 1, 2, 2, 3, 4, 4, 5, 7, 9, 10, 11, 13, 15, 1, 2, 2, 2, 3, 4, 4, 4, 5, 6, 6, 7, 9, 9, 9, 9, 9, 10, 10, 12, 3, 4,
  4, 5, 14, 3, 6, 6, 6,
];
const E_T = [
  4, 6, 12, 1, 5, 4, 2, 13, 9, 3, 4, 11, 4, 13, 1, 7, 1, 9, 10, 10, 3, 7, 10, 10, 6, 10, 10, 1, 2, 3, 4, 8, 6, 9, 8, 16,
  22, 23, 23, 10, 50, 44, 46, 50,
];

// Terms 52–54: n δ^d τ^t exp(−α(δ−ε)² − β(τ−γ)²)
const G_N = [-0.31306260323435e2, 0.31546140237781e2, -0.25213154341695e4];
const G_D = [3, 3, 3];
const G_T = [0, 1, 4];
const G_ALPHA = [20, 20, 20];
const G_BETA = [150, 150, 250];
const G_GAMMA = [1.21, 1.21, 1.25];
const G_EPS = [1, 1, 1];

// Ideal-gas part (Table 1): only n°3 and the Planck–Einstein terms enter c_v and c_p.
const I_N3 = 3.00632;
const I_N = [0.012436, 0.97315, 1.2795, 0.96956, 0.24873];
const I_GAMMA = [1.28728967, 3.53734222, 7.74073708, 9.24437796, 27.5075105];

export interface ResidualDerivs {
  d: number; // φr_δ
  dd: number; // φr_δδ
  tt: number; // φr_ττ
  dt: number; // φr_δτ
}

export function residual(delta: number, tau: number): ResidualDerivs {
  let d = 0,
    dd = 0,
    tt = 0,
    dt = 0;
  for (let i = 0; i < P_N.length; i++) {
    const n = P_N[i],
      di = P_D[i],
      ti = P_T[i];
    const base = n * delta ** di * tau ** ti;
    d += (base * di) / delta;
    dd += (base * di * (di - 1)) / (delta * delta);
    tt += (base * ti * (ti - 1)) / (tau * tau);
    dt += (base * di * ti) / (delta * tau);
  }
  for (let i = 0; i < E_N.length; i++) {
    const n = E_N[i],
      c = E_C[i],
      di = E_D[i],
      ti = E_T[i];
    const dc = delta ** c;
    const base = n * delta ** di * tau ** ti * Math.exp(-dc);
    const k = di - c * dc;
    d += (base * k) / delta;
    dd += (base * (k * (k - 1) - c * c * dc)) / (delta * delta);
    tt += (base * ti * (ti - 1)) / (tau * tau);
    dt += (base * k * ti) / (delta * tau);
  }
  for (let i = 0; i < G_N.length; i++) {
    const n = G_N[i],
      di = G_D[i],
      ti = G_T[i],
      a = G_ALPHA[i],
      b = G_BETA[i],
      g = G_GAMMA[i],
      e = G_EPS[i];
    const base = n * delta ** di * tau ** ti * Math.exp(-a * (delta - e) ** 2 - b * (tau - g) ** 2);
    const kd = di / delta - 2 * a * (delta - e);
    const kt = ti / tau - 2 * b * (tau - g);
    d += base * kd;
    dd += base * (kd * kd - di / (delta * delta) - 2 * a);
    tt += base * (kt * kt - ti / (tau * tau) - 2 * b);
    dt += base * kd * kt;
  }
  return { d, dd, tt, dt };
}

function idealTauTau(tau: number): number {
  let s = -I_N3 / (tau * tau);
  for (let i = 0; i < I_N.length; i++) {
    const x = Math.exp(-I_GAMMA[i] * tau);
    s -= (I_N[i] * I_GAMMA[i] * I_GAMMA[i] * x) / ((1 - x) * (1 - x));
  }
  return s;
}

/** Pressure (Pa) from temperature (K) and density (kg/m³). */
export function pressure(T: number, rho: number): number {
  const r = residual(rho / RHOC, TC / T);
  return rho * R_SPECIFIC * T * (1 + (rho / RHOC) * r.d);
}

/** Liquid density (kg/m³) at T (K) and p (Pa), by Newton iteration from a liquid-like start. */
export function liquidDensity(T: number, p: number): number {
  const tau = TC / T;
  let rho = 1000;
  for (let it = 0; it < 50; it++) {
    const delta = rho / RHOC;
    const r = residual(delta, tau);
    const f = rho * R_SPECIFIC * T * (1 + delta * r.d) - p;
    const dfdrho = R_SPECIFIC * T * (1 + 2 * delta * r.d + delta * delta * r.dd);
    const step = f / dfdrho;
    rho -= step;
    if (Math.abs(step) < 1e-10 * rho) return rho;
  }
  throw new Error('IAPWS-95 density iteration did not converge');
}

/** Isochoric and isobaric specific heat capacities, J/(kg·K). */
export function heatCapacities(T: number, rho: number): { cv: number; cp: number } {
  const delta = rho / RHOC,
    tau = TC / T;
  const r = residual(delta, tau);
  const cv = -tau * tau * (idealTauTau(tau) + r.tt) * R_SPECIFIC;
  const num = (1 + delta * r.d - delta * tau * r.dt) ** 2;
  const den = 1 + 2 * delta * r.d + delta * delta * r.dd;
  return { cv, cp: cv + (num / den) * R_SPECIFIC };
}
