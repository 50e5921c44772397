import { KQ_TERMS, KT_TERMS, type BTerm } from './data/wageningen-b';
import { OutOfRangeError } from './errors';
import { timesTenTo } from './numeric';

// Wageningen B-series open-water model. For a fixed propeller (Z, A_E/A_0, P/D) both polynomials collapse to
// cubics in J, which is what makes the race solve and the propeller sweep cheap.

export type Cubic = readonly [number, number, number, number];

export interface BSeriesPropeller {
  blades: number;
  bladeAreaRatio: number;
  pitchRatio: number;
  kt: Cubic;
  kq: Cubic;
  /** advance ratio where K_T falls to zero */
  jZeroThrust: number;
}

/** Polynomial validity (memory; quoted by public implementations, REFERENCES §1). */
export const B_RANGE = {
  blades: [2, 7],
  bladeAreaRatio: [0.3, 1.05],
  pitchRatio: [0.5, 1.4],
} as const;

/** Blade-area ratios of the tested models for each blade number (memory, REFERENCES §1). */
export const B_COVERAGE: Record<number, readonly [number, number]> = {
  2: [0.3, 0.38],
  3: [0.35, 0.8],
  4: [0.4, 1.0],
  5: [0.45, 1.05],
  6: [0.5, 0.8],
  7: [0.55, 0.85],
};

function collapse(terms: readonly BTerm[], Z: number, ae: number, pd: number): Cubic {
  const c = [0, 0, 0, 0];
  for (const [C, s, t, u, v] of terms) c[s] += C * pd ** t * ae ** u * Z ** v;
  return [c[0], c[1], c[2], c[3]];
}

export function cubic(c: Cubic, x: number): number {
  return c[0] + x * (c[1] + x * (c[2] + x * c[3]));
}

export function cubicSlope(c: Cubic, x: number): number {
  return c[1] + x * (2 * c[2] + x * 3 * c[3]);
}

/** Full polynomial evaluation term by term (used by the tests to check the collapsed form). */
export function polynomial(terms: readonly BTerm[], J: number, pd: number, ae: number, Z: number): number {
  let s = 0;
  for (const [C, sj, t, u, v] of terms) s += C * J ** sj * pd ** t * ae ** u * Z ** v;
  return s;
}

export function checkBSeriesRange(blades: number, bladeAreaRatio: number, pitchRatio: number): void {
  const [zMin, zMax] = B_RANGE.blades;
  if (!Number.isInteger(blades) || blades < zMin || blades > zMax)
    throw new OutOfRangeError(
      'blades',
      `The B-series polynomials cover ${zMin} to ${zMax} blades; ${blades} is outside.`,
    );
  const [aMin, aMax] = B_RANGE.bladeAreaRatio;
  if (bladeAreaRatio < aMin - 1e-12 || bladeAreaRatio > aMax + 1e-12)
    throw new OutOfRangeError(
      'bladeAreaRatio',
      `The B-series polynomials cover A_E/A_0 ${aMin}–${aMax}; ${bladeAreaRatio} is outside.`,
    );
  const [pMin, pMax] = B_RANGE.pitchRatio;
  if (pitchRatio < pMin - 1e-12 || pitchRatio > pMax + 1e-12)
    throw new OutOfRangeError(
      'pitchRatio',
      `The B-series polynomials cover P/D ${pMin}–${pMax}; ${pitchRatio} is outside.`,
    );
}

export function coverageWarning(blades: number, bladeAreaRatio: number): string | null {
  const cov = B_COVERAGE[blades];
  if (!cov) return null;
  if (bladeAreaRatio < cov[0] - 1e-12 || bladeAreaRatio > cov[1] + 1e-12)
    return `A_E/A_0 ${bladeAreaRatio} lies outside the blade areas actually tested for ${blades} blades (${cov[0]}–${cov[1]}): the polynomial is extrapolating between series members, treat the result with extra caution.`;
  return null;
}

export function bSeries(blades: number, bladeAreaRatio: number, pitchRatio: number): BSeriesPropeller {
  checkBSeriesRange(blades, bladeAreaRatio, pitchRatio);
  const kt = collapse(KT_TERMS, blades, bladeAreaRatio, pitchRatio);
  const kq = collapse(KQ_TERMS, blades, bladeAreaRatio, pitchRatio);
  return { blades, bladeAreaRatio, pitchRatio, kt, kq, jZeroThrust: zeroThrustJ(kt) };
}

/** First advance ratio above 0 where K_T = 0 (K_T(0) > 0 throughout the series range). */
function zeroThrustJ(kt: Cubic): number {
  let lo = 0;
  let hi = 0.05;
  while (cubic(kt, hi) > 0 && hi < 3) {
    lo = hi;
    hi += 0.05;
  }
  for (let i = 0; i < 80; i++) {
    const mid = 0.5 * (lo + hi);
    if (cubic(kt, mid) > 0) lo = mid;
    else hi = mid;
  }
  return 0.5 * (lo + hi);
}

export function openWaterEfficiency(p: BSeriesPropeller, J: number): number {
  if (J <= 0) return 0;
  const kt = cubic(p.kt, J);
  const kq = cubic(p.kq, J);
  return (J * kt) / (2 * Math.PI * kq);
}

/**
 * Advance ratio where K_T/J² equals `c` (c > 0). K_T/J² falls monotonically from +∞ at J→0 to 0 at the
 * zero-thrust J, so the root is unique; Newton steps guarded by a bracket.
 */
export function advanceRatioForLoading(p: BSeriesPropeller, c: number): number {
  let lo = 0;
  let hi = p.jZeroThrust;
  let J = Math.min(0.5 * hi, Math.sqrt(cubic(p.kt, 0) / c));
  for (let i = 0; i < 60; i++) {
    const kt = cubic(p.kt, J);
    const f = kt - c * J * J;
    if (f > 0) lo = J;
    else hi = J;
    const df = cubicSlope(p.kt, J) - 2 * c * J;
    let next = df < 0 ? J - f / df : 0.5 * (lo + hi);
    if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);
    if (Math.abs(next - J) < 1e-13) return next;
    J = next;
  }
  return J;
}

/** Chord length at 0.75R over diameter, c₀.₇₅/D = 2.073·(A_E/A_0)/Z (memory, REFERENCES §1). */
export function chordRatio075(blades: number, bladeAreaRatio: number): number {
  return (2.073 * bladeAreaRatio) / blades;
}

/** Blade-section Reynolds number at 0.75R. n in rev/s. */
export function reynolds075(
  p: { blades: number; bladeAreaRatio: number },
  D: number,
  n: number,
  vA: number,
  nu: number,
): number {
  const c = chordRatio075(p.blades, p.bladeAreaRatio) * D;
  return (c * Math.sqrt(vA * vA + (0.75 * Math.PI * n * D) ** 2)) / nu;
}

export const RN_SERIES = 2e6;

export function reynoldsWarning(rn: number): string | null {
  if (rn >= RN_SERIES) return null;
  return `Blade Reynolds number Rn₀.₇₅ ≈ ${timesTenTo(rn, 1)} is below the 2·10⁶ of the series polynomials: small propellers in partly laminar flow usually give less thrust and need more torque than predicted, so expect the real efficiency to be somewhat lower (no correction is applied below 2·10⁶).`;
}
