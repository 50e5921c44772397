import { describe, it, expect } from 'vitest';
import { runCalculator } from '../../../src/lib/calc';

// The solar page's charts: array power and cell temperature across the day's irradiance, on the same model as the
// result (physical sanity, derived: no published values involved).
describe('solar series', () => {
  const run = (raw: Record<string, unknown>) => {
    const r = runCalculator('solar', raw);
    if (!r.ok) throw new Error(JSON.stringify(r));
    return r.result;
  };

  it('passes through the result at the chosen irradiance, for both cell-temperature models', () => {
    for (const cellTemperatureModel of ['noct', 'faiman']) {
      const r = run({ irradiance_Wm2: 800, cellTemperatureModel, windSpeed_mps: 3 });
      const { power, temperature } = r.series!;
      const i = power.x.values.indexOf(800);
      expect(i).toBeGreaterThan(0);
      expect(power.y[0].values[i]).toBeCloseTo(r.outputs.power_W as number, 9);
      expect(temperature.y[0].values[i]).toBeCloseTo(r.outputs.cellTemperature_C as number, 9);
    }
  });

  it('power rises with irradiance from zero, and the cells warm as the sun strengthens', () => {
    const { power, temperature } = run({}).series!;
    expect(power.y[0].values[0]).toBe(0);
    for (let i = 1; i < power.x.values.length; i++) {
      expect(power.y[0].values[i]).toBeGreaterThan(power.y[0].values[i - 1]);
      expect(temperature.y[0].values[i]).toBeGreaterThan(temperature.y[0].values[i - 1]);
    }
  });
});
