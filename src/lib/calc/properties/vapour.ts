import { STANDARD_SALINITY } from './seawater';
import type { WaterKind } from './water';

// Saturation (vapour) pressure of water for the cavitation checks.
//
// Pure water: the saturation-pressure equation of IAPWS-IF97 (IAPWS R7-97(2012), "Revised Release on the IAPWS
// Industrial Formulation 1997 for the Thermodynamic Properties of Water and Steam", region 4, Eqs. 29–30,
// Table 34), whose verification value (Table 35: 300 K → 0.353658941·10⁻² MPa) the tests reproduce. Between 0 and
// 40 °C it agrees with the IAPWS-95 saturation line to better than 0.02 %.
// Seawater: lowered by the ratio of Sharqawy, Lienhard & Zubair (2010), Eq. 6 (after Robinson 1954),
// p_v,sw = p_v,w / (1 + 0.57357·S/(1000 − S)), S in g/kg.

const N = [
  0.11670521452767e4, -0.72421316703206e6, -0.17073846940092e2, 0.1202082470247e5, -0.32325550322333e7,
  0.1491510861353e2, -0.48232657361591e4, 0.40511340542057e6, -0.23855557567849, 0.65017534844798e3,
];

/** IAPWS-IF97 saturation pressure (Pa) at temperature T (K), 273.15–647.096 K. */
export function saturationPressureIF97(T: number): number {
  const theta = T + N[8] / (T - N[9]);
  const A = theta * theta + N[0] * theta + N[1];
  const B = N[2] * theta * theta + N[3] * theta + N[4];
  const C = N[5] * theta * theta + N[6] * theta + N[7];
  return ((2 * C) / (-B + Math.sqrt(B * B - 4 * A * C))) ** 4 * 1e6;
}

/** Sharqawy et al. (2010) Eq. 6: seawater over pure-water vapour pressure at absolute salinity S (g/kg). */
export function seawaterVapourRatio(salinity_gkg: number): number {
  return 1 / (1 + (0.57357 * salinity_gkg) / (1000 - salinity_gkg));
}

/** Vapour pressure (Pa) of fresh water or standard seawater at tempC (°C). */
export function vapourPressure(tempC: number, water: WaterKind): number {
  const pw = saturationPressureIF97(tempC + 273.15);
  return water === 'sea' ? pw * seawaterVapourRatio(STANDARD_SALINITY * 1000) : pw;
}
