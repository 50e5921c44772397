// Vapour (saturation) pressure of water, IAPWS-IF97 Eq. 30 (region 4), valid 273.15–647.096 K.
const N = [
  0.11670521452767e4, -0.72421316703206e6, -0.17073846940092e2, 0.1202082470247e5, -0.32325550322333e7,
  0.1491510861353e2, -0.48232657361591e4, 0.40511340542057e6, -0.23855557567849, 0.65017534844798e3,
];

/** Saturation pressure of pure water, Pa, at temperature T in kelvin. */
export function saturationPressure(T: number): number {
  const theta = T + N[8] / (T - N[9]);
  const A = theta * theta + N[0] * theta + N[1];
  const B = N[2] * theta * theta + N[3] * theta + N[4];
  const C = N[5] * theta * theta + N[6] * theta + N[7];
  const p = Math.pow((2 * C) / (-B + Math.sqrt(B * B - 4 * A * C)), 4); // MPa
  return p * 1e6;
}
