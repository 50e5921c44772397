// The motor's envelope at the propeller shaft: most power, most rpm, most torque. A small pod motor by default.
import { cubic, type Cubic, type BSeriesPropeller } from './bseries';
import { num } from './fields';
import type { InputMeta } from './types';

export interface MotorEnvelope {
  maxShaftPower_W: number;
  maxRpm: number;
  maxTorque_Nm: number;
}

export type EnvelopeLimit = 'power' | 'rpm' | 'torque';

export const envelopeInputs = (group = 'Motor'): InputMeta[] => [
  num({
    name: 'maxShaftPower_W',
    label: 'Maximum shaft power',
    unit: 'W',
    min: 1,
    max: 500000,
    step: 10,
    default: 6000,
    group,
    help: 'Most power the motor gives at the propeller shaft. Defaults describe a small pod motor: 6 kW, 20 N·m up to about 2,860 rpm, 3,000 rpm at most — take yours from the motor’s datasheet (after any gearbox).',
  }),
  num({
    name: 'maxRpm',
    label: 'Maximum shaft speed',
    unit: 'rpm',
    min: 10,
    max: 20000,
    step: 10,
    default: 3000,
    group,
    help: 'Highest propeller shaft speed the motor and gearing allow (demo default 3,000 rpm).',
  }),
  num({
    name: 'maxTorque_Nm',
    label: 'Maximum shaft torque',
    unit: 'N·m',
    min: 0.1,
    max: 10000,
    step: 0.5,
    default: 20,
    group,
    help: 'Most torque at the propeller shaft (motor torque × gear ratio × gear efficiency; demo default 20 N·m).',
  }),
];

const TWO_PI = 2 * Math.PI;

export interface AllowedRevs {
  /** rev/s */
  n: number;
  limitedBy: EnvelopeLimit;
}

/**
 * Advance ratio J in (0, jHi] where K_Q(J) = c·J^k (k = 2 for a torque limit, 3 for a power limit at fixed V_A).
 * K_Q(J)/J^k falls monotonically on that interval, so the root is unique; guarded Newton steps. Returns jHi when
 * even there K_Q/J^k is above c.
 */
function loadingJ(kq: Cubic, c: number, k: 2 | 3, jHi: number): number {
  // written out without closures or calls: this runs a few hundred times per sprint and thousands per sweep
  const [q0, q1, q2, q3] = kq;
  const fHi = q0 + jHi * (q1 + jHi * (q2 + jHi * q3)) - c * (k === 2 ? jHi * jHi : jHi * jHi * jHi);
  if (fHi >= 0) return jHi;
  let lo = 0;
  let hi = jHi;
  let J = Math.min(0.5 * jHi, (q0 / c) ** (1 / k));
  for (let i = 0; i < 60; i++) {
    const Jk1 = k === 2 ? J : J * J;
    const fJ = q0 + J * (q1 + J * (q2 + J * q3)) - c * Jk1 * J;
    if (fJ > 0) lo = J;
    else hi = J;
    const d = q1 + J * (2 * q2 + J * 3 * q3) - k * c * Jk1;
    let next = d < 0 ? J - fJ / d : 0.5 * (lo + hi);
    if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);
    if (Math.abs(next - J) < 1e-14) return next;
    J = next;
  }
  return J;
}

/**
 * Highest shaft speed (rev/s) the envelope allows for a propeller advancing at vA (m/s): the lowest of the rpm
 * limit and the speeds at which torque or power reach their limits (both rise with n at fixed V_A). Never below
 * the speed at which the propeller stops giving thrust.
 */
export function allowedRevs(p: BSeriesPropeller, D: number, vA: number, rho: number, env: MotorEnvelope): AllowedRevs {
  const nMax = env.maxRpm / 60;
  const D5 = D ** 5;
  if (vA > 0 && nMax < vA / (p.jZeroThrust * D)) return { n: nMax, limitedBy: 'rpm' };
  let n = nMax;
  let limitedBy: EnvelopeLimit = 'rpm';
  let Q = cubic(p.kq, vA / (nMax * D)) * rho * nMax * nMax * D5;
  // torque first, then power at the speed the torque allows; each solved only when it binds
  if (Q > env.maxTorque_Nm) {
    // bollard: Q = K_Q(0)·ρ·n²·D⁵; advancing: Q = ρ·D³·V_A²·K_Q(J)/J² with J = V_A/(n·D)
    n =
      vA > 0
        ? vA / (loadingJ(p.kq, env.maxTorque_Nm / (rho * D * D * D * vA * vA), 2, p.jZeroThrust) * D)
        : Math.sqrt(env.maxTorque_Nm / (cubic(p.kq, 0) * rho * D5));
    Q = env.maxTorque_Nm;
    limitedBy = 'torque';
  }
  if (TWO_PI * n * Q > env.maxShaftPower_W) {
    // P = 2π·K_Q(0)·ρ·n³·D⁵ at the bollard; P = 2π·ρ·D²·V_A³·K_Q(J)/J³ advancing
    n =
      vA > 0
        ? vA / (loadingJ(p.kq, env.maxShaftPower_W / (TWO_PI * rho * D * D * vA * vA * vA), 3, p.jZeroThrust) * D)
        : Math.cbrt(env.maxShaftPower_W / (TWO_PI * cubic(p.kq, 0) * rho * D5));
    limitedBy = 'power';
  }
  return { n, limitedBy };
}
