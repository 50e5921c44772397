import { describe, expect, it } from 'vitest';
import { runCalculator } from '../../src/lib/calc';
import { pvwattsDc, rossCellTemperature } from '../../src/lib/calc/solar';

// R.G. Ross Jr. (1981), "Design techniques for flat-plate photovoltaic arrays", 15th IEEE PVSC; test vectors from
// the pvlib-python test suite, test_temperature.py::test_ross (published).
describe('Ross cell temperature — pvlib-python test_temperature.py::test_ross vectors (published)', () => {
  it('G 1000, T_a 20, NOCT 40 → 45 °C', () => expect(rossCellTemperature(1000, 20, 40)).toBeCloseTo(45, 12));
  it('G 600, T_a 40, NOCT 100 → 100 °C', () => expect(rossCellTemperature(600, 40, 100)).toBeCloseTo(100, 12));
  it('G 1000, T_a 60, NOCT 20 → 60 °C', () => expect(rossCellTemperature(1000, 60, 20)).toBeCloseTo(60, 12));
});

// A.P. Dobos (2014), "PVWatts Version 5 Manual", NREL/TP-6A20-62641; vector from pvlib-python
// test_pvsystem.py::test_pvwatts_dc_scalars (published).
describe('PVWatts DC power — pvlib-python test_pvsystem.py::test_pvwatts_dc_scalars (published)', () => {
  it('G 900, T_c 30, P_STC 100 W, γ −0.003 → 88.65 W', () =>
    expect(pvwattsDc(900, 30, 100, -0.003)).toBeCloseTo(88.65, 10));
});

describe('solar calculator chains Ross + PVWatts (Ross 1981; Dobos 2014; derived)', () => {
  it('1 m² at 20 % → P_STC 200 W; G 1000, T_a 20, NOCT 40 → T_c 45 °C; γ −0.004, losses 0.1 → 200·(1 − 0.08)·0.9 W', () => {
    const r = runCalculator('solar', {
      area_m2: 1,
      moduleEfficiency: 0.2,
      irradiance_Wm2: 1000,
      ambient_C: 20,
      noct_C: 40,
      tempCoefficient_perK: -0.004,
      otherLosses: 0.1,
    });
    if (!r.ok) throw new Error(JSON.stringify(r));
    const o = r.result.outputs as Record<string, number>;
    expect(o.ratedPower_W).toBeCloseTo(200, 10);
    expect(o.cellTemperature_C).toBeCloseTo(45, 10);
    expect(o.power_W).toBeCloseTo(200 * (1 - 0.004 * 20) * 0.9, 10);
    expect(r.result.warnings.join(' ')).toMatch(/[Dd]eck-mounted/);
  });
});
