import { fitFormFactor } from '../calc/fit';
import { waterProperties } from '../calc/properties/water';
import { RE_MIN, resistanceCalculator, type ResistanceInput } from '../calc/resistance';
import type { ResistanceFitInput } from '../schemas/calc-fit';
import { computeOrThrow } from './calculations';
import { invalidInput } from './http';

const FORM_FACTOR_RANGE = [1, 2] as const;

/**
 * Fits the resistance calculator's form factor (1+k) to logged speed and electrical power. The hull inputs are
 * checked like a run (400 per field, 422 out of range); points below the friction line's Reynolds number are refused
 * per point. Returns the fit and, when the fitted value is one the calculator accepts, the inputs of the fitted run.
 */
export function fitResistance(body: ResistanceFitInput) {
  const run = computeOrThrow('resistance', body.inputs);
  const hull = run.inputs as unknown as ResistanceInput;
  const w = waterProperties(hull.temperature_C, hull.water);
  const vMin = (RE_MIN * w.kinematicViscosity_m2s) / hull.length_m;
  const slow = body.points.flatMap((p, i) =>
    p.speed_mps < vMin
      ? [
          {
            path: `points.${i}.speed_mps`,
            message: `Below ${vMin.toFixed(2)} m/s the ITTC-1957 line does not apply (Re < 1·10⁵); leave such points out.`,
          },
        ]
      : [],
  );
  if (slow.length) throw invalidInput(slow.slice(0, 20));
  const fit = fitFormFactor(hull, body.points, body.drivetrainEfficiency);
  const inRange = fit.formFactor >= FORM_FACTOR_RANGE[0] && fit.formFactor <= FORM_FACTOR_RANGE[1];
  const warnings: string[] = [];
  if (!inRange)
    warnings.push(
      `The fitted form factor ${fit.formFactor.toFixed(3)} is outside 1–2: check the log's units, the drivetrain efficiency and the wetted surface; waves, wind or a planing hull make friction-only resistance the wrong model.`,
    );
  if (fit.rSquared !== null && fit.rSquared < 0.9)
    warnings.push(
      `R² ${fit.rSquared.toFixed(2)}: the friction model explains the log poorly; look at the residuals for speeds where another effect takes over.`,
    );
  return {
    formFactor: fit.formFactor,
    rSquared: fit.rSquared,
    residuals: fit.residuals,
    inputs: inRange ? { ...run.inputs, formFactor: Math.round(fit.formFactor * 10000) / 10000 } : null,
    drivetrainEfficiency: body.drivetrainEfficiency,
    warnings,
    engineVersion: resistanceCalculator.engineVersion,
  };
}
