// The motor's envelope at the propeller shaft: most power, most rpm, most torque. A small pod motor by default.
import { cubic, type BSeriesPropeller } from './bseries';
import { num } from './fields';
import { brent } from './numeric';
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
 * Highest shaft speed (rev/s) the envelope allows for a propeller advancing at vA (m/s): the lowest of the rpm
 * limit and the speeds at which torque or power reach their limits (both rise with n at fixed V_A).
 */
export function allowedRevs(
  p: BSeriesPropeller,
  D: number,
  vA: number,
  rho: number,
  env: MotorEnvelope,
): AllowedRevs {
  const D5 = D ** 5;
  const torque = (n: number) => cubic(p.kq, vA / (n * D)) * rho * n * n * D5;
  const nMax = env.maxRpm / 60;
  // below nZero the propeller gives no thrust; n never needs to go lower than that
  const nZero = vA > 0 ? vA / (p.jZeroThrust * D) : 0;
  let n = nMax;
  let limitedBy: EnvelopeLimit = 'rpm';
  if (nMax <= nZero) return { n: nMax, limitedBy };
  const qMax = torque(nMax);
  if (qMax > env.maxTorque_Nm) {
    const lo = Math.max(nZero, 1e-9);
    n = torque(lo) >= env.maxTorque_Nm ? lo : brent((x) => torque(x) - env.maxTorque_Nm, lo, nMax, 1e-10);
    limitedBy = 'torque';
  }
  if (TWO_PI * n * torque(n) > env.maxShaftPower_W) {
    const lo = Math.max(nZero, 1e-9);
    const power = (x: number) => TWO_PI * x * torque(x) - env.maxShaftPower_W;
    n = power(lo) >= 0 ? lo : brent(power, lo, n, 1e-10);
    limitedBy = 'power';
  }
  return { n, limitedBy };
}
