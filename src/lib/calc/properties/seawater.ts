// Saline part of the TEOS-10 Gibbs function, pressure derivative only.
// Source: IAPWS R13-08, "Release on the IAPWS Formulation 2008 for the Thermodynamic Properties of Seawater"
// (also R. Feistel (2008), Deep-Sea Research I 55, 1639–1671), Table 2: the coefficients g_ijk with k ≥ 1
// (the k = 0 terms and the ξ² ln ξ terms do not depend on pressure, so they drop out of ∂g_S/∂p).
// Specific volume of seawater v = v_W + ∂g_S/∂p (Eq. 4 of the release); g* = 1 J/kg, p* = 100 MPa,
// π = (p − 0.101325 MPa)/p*, τ = t/40 °C, ξ = √(S/S*).

const S_STAR = (0.03516504 * 40) / 35; // kg/kg, reducing salinity
const P_STAR = 1e8; // Pa
const P_ZERO = 101325; // Pa

// [i, j, k, g_ijk] for ξ^i τ^j π^k
const G: [number, number, number, number][] = [
  [2, 0, 1, -0.331049154044839e4],
  [3, 0, 1, 0.199459603073901e3],
  [4, 0, 1, -0.547919133532887e2],
  [5, 0, 1, 0.360284195611086e2],
  [2, 1, 1, 0.729116529735046e3],
  [3, 1, 1, -0.175292041186547e3],
  [4, 1, 1, -0.226683558512829e2],
  [2, 2, 1, -0.860764303783977e3],
  [3, 2, 1, 0.383058066002476e3],
  [2, 3, 1, 0.694244814133268e3],
  [3, 3, 1, -0.460319931801257e3],
  [2, 4, 1, -0.297728741987187e3],
  [3, 4, 1, 0.234565187611355e3],
  [2, 0, 2, 0.384794152978599e3],
  [3, 0, 2, -0.522940909281335e2],
  [4, 0, 2, -0.408193978912261e1],
  [2, 1, 2, -0.343956902961561e3],
  [3, 1, 2, 0.831923927801819e2],
  [2, 2, 2, 0.337409530269367e3],
  [3, 2, 2, -0.541917262517112e2],
  [2, 3, 2, -0.204889641964903e3],
  [2, 4, 2, 0.74726141138756e2],
  [2, 0, 3, -0.965324320107458e2],
  [3, 0, 3, 0.680444942726459e2],
  [4, 0, 3, -0.301755111971161e2],
  [2, 1, 3, 0.124687671116248e3],
  [3, 1, 3, -0.29483064349429e2],
  [2, 2, 3, -0.178314556207638e3],
  [3, 2, 3, 0.256398487389914e2],
  [2, 3, 3, 0.113561697840594e3],
  [2, 4, 3, -0.364872919001588e2],
  [2, 0, 4, 0.158408172766824e2],
  [3, 0, 4, -0.341251932441282e1],
  [2, 1, 4, -0.31656964386073e2],
  [2, 2, 4, 0.442040358308e2],
  [2, 3, 4, -0.111282734326413e2],
  [2, 0, 5, -0.262480156590992e1],
  [2, 1, 5, 0.704658803315449e1],
  [2, 2, 5, -0.792001547211682e1],
];

/** ∂g_S/∂p in m³/kg for absolute salinity S (kg/kg), Celsius temperature t and absolute pressure p (Pa). */
export function salineSpecificVolume(S: number, tC: number, p: number): number {
  if (S === 0) return 0;
  const xi = Math.sqrt(S / S_STAR);
  const tau = tC / 40;
  const pi = (p - P_ZERO) / P_STAR;
  let sum = 0;
  for (const [i, j, k, g] of G) sum += k * g * xi ** i * tau ** j * pi ** (k - 1);
  return sum / P_STAR;
}

/** Standard seawater absolute salinity, kg/kg (Millero et al. 2008 reference composition). */
export const STANDARD_SALINITY = 0.03516504;

/**
 * Seawater dynamic viscosity from the pure-water value.
 * Source: M.H. Sharqawy, J.H. Lienhard V & S.M. Zubair (2010), "Thermophysical properties of seawater: a review
 * of existing correlations and data", Desalination and Water Treatment 16, 354–380, Eq. 22 — the correlation
 * used for seawater viscosity in ITTC 7.5-02-01-03 (2011). S in kg/kg, t in °C.
 */
export function seawaterViscosityRatio(S: number, tC: number): number {
  const A = 1.541 + 1.998e-2 * tC - 9.52e-5 * tC * tC;
  const B = 7.974 - 7.561e-2 * tC + 4.724e-4 * tC * tC;
  return 1 + A * S + B * S * S;
}
