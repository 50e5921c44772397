// Darcy–Weisbach pipe loss with the laminar 64/Re law and the Colebrook equation (solved by Newton on
// x = 1/√f). Haaland and Swamee–Jain are explicit approximations, kept for comparison and tests.

export const RE_LAMINAR = 2300;
export const RE_TURBULENT = 4000;

/** Colebrook (1939): 1/√f = −2 log₁₀(ε/D/3.7 + 2.51/(Re √f)). */
export function colebrook(re: number, relRough: number): number {
  const a = relRough / 3.7;
  const b = 2.51 / re;
  const LN10 = Math.LN10;
  let x = 1 / Math.sqrt(swameeJain(re, relRough));
  for (let i = 0; i < 50; i++) {
    const inner = a + b * x;
    const g = x + (2 * Math.log(inner)) / LN10;
    const dg = 1 + (2 * b) / (inner * LN10);
    const step = g / dg;
    x -= step;
    if (Math.abs(step) < 1e-15 * x) break;
  }
  return 1 / (x * x);
}

/** Haaland (1983): 1/√f = −1.8 log₁₀[(ε/D/3.7)^1.11 + 6.9/Re]. */
export function haaland(re: number, relRough: number): number {
  const x = -1.8 * Math.log10((relRough / 3.7) ** 1.11 + 6.9 / re);
  return 1 / (x * x);
}

/**
 * Swamee & Jain (1976): f = 0.25/[log₁₀(ε/D/3.7 + (6.97/Re)^0.9)]². Written with (6.97/Re)^0.9 (= 5.7397/Re^0.9)
 * as in Winning & Coole (2013) and the fluids library, whose example value the tests use; the often-quoted
 * rounded 5.74 differs by about 1e-6 relative.
 */
export function swameeJain(re: number, relRough: number): number {
  const l = Math.log10(relRough / 3.7 + (6.97 / re) ** 0.9);
  return 0.25 / (l * l);
}

/** Darcy friction factor: 64/Re below Re 2300, Colebrook above (also used, with a warning, in transition). */
export function frictionFactor(re: number, relRough: number): number {
  if (re < RE_LAMINAR) return 64 / re;
  return colebrook(re, relRough);
}

/** Δp = f·(L/D)·ρU²/2, Pa. */
export function darcyWeisbach(f: number, length_m: number, bore_m: number, rho: number, U: number): number {
  return (f * (length_m / bore_m) * rho * U * U) / 2;
}
