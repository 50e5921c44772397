import { describe, expect, it } from 'vitest';
import { runCalculator } from '../../src/lib/calc';
import { faimanCellTemperature, pvwattsDc, rossCellTemperature } from '../../src/lib/calc/solar';

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

// D. Faiman (2008), "Assessing the outdoor operating temperature of photovoltaic modules", Progress in Photovoltaics
// 16(4), 307–315 (U₀ 25.0 W/m²K, U₁ 6.84 W·s/m³K). Check values from pvlib-python's independent implementation,
// pvlib.temperature.faiman, tests test_temperature.py::test_faiman_default / _kwargs / _list (published, ±0.001 K).
describe('Faiman cell temperature — pvlib-python test_temperature.py::test_faiman_* vectors (published)', () => {
  it('test_faiman_default: G 900, T_a 20, wind 5 → 35.203 °C', () =>
    expect(Math.abs(faimanCellTemperature(900, 20, 5) - 35.203)).toBeLessThan(1e-3));
  it('test_faiman_kwargs: G 900, T_a 20, wind 5, U₀ 22, U₁ 6 → 37.308 °C', () =>
    expect(Math.abs(faimanCellTemperature(900, 20, 5, 22, 6) - 37.308)).toBeLessThan(1e-3));
  it('test_faiman_list: (0, 0, 10) → 0; (500, 10, 5) → 18.446; (0, 5, 0) → 5', () => {
    expect(faimanCellTemperature(0, 0, 10)).toBe(0);
    expect(Math.abs(faimanCellTemperature(500, 10, 5) - 18.446)).toBeLessThan(1e-3);
    expect(faimanCellTemperature(0, 5, 0)).toBe(5);
  });
});

describe('solar calculator with the Faiman model (Faiman 2008; PVWatts; derived and physical sanity)', () => {
  const run = (raw: Record<string, unknown>) => {
    const r = runCalculator('solar', raw);
    if (!r.ok) throw new Error(JSON.stringify(r));
    return r.result;
  };
  it('NOCT stays the default model: the default result is the Ross one', () => {
    const o = run({}).outputs as Record<string, number>;
    expect(o.cellTemperature_C).toBeCloseTo(rossCellTemperature(800, 25, 45), 12);
  });
  it('Faiman chains into PVWatts: G 900, T_a 20, wind 5 → T_c 35.203 °C and the matching power', () => {
    const o = run({
      cellTemperatureModel: 'faiman',
      irradiance_Wm2: 900,
      ambient_C: 20,
      windSpeed_mps: 5,
      area_m2: 1,
      moduleEfficiency: 0.2,
      tempCoefficient_perK: -0.004,
      otherLosses: 0,
    }).outputs as Record<string, number>;
    const Tc = 20 + 900 / (25 + 6.84 * 5);
    expect(o.cellTemperature_C).toBeCloseTo(Tc, 12);
    expect(o.power_W).toBeCloseTo(pvwattsDc(900, Tc, 200, -0.004), 10);
  });
  it('more wind → cooler cells → more power; no wind limit is T_a + G/U₀', () => {
    let prevT = Infinity;
    let prevP = -Infinity;
    for (const v of [0, 1, 2, 4, 8, 15]) {
      const o = run({ cellTemperatureModel: 'faiman', windSpeed_mps: v }).outputs as Record<string, number>;
      expect(o.cellTemperature_C).toBeLessThan(prevT);
      expect(o.power_W).toBeGreaterThan(prevP);
      prevT = o.cellTemperature_C;
      prevP = o.power_W;
    }
    const still = run({ cellTemperatureModel: 'faiman', windSpeed_mps: 0 }).outputs as Record<string, number>;
    expect(still.cellTemperature_C).toBeCloseTo(25 + 800 / 25, 12);
  });
  it('the NOCT model says it ignores a wind speed given to it', () => {
    expect(run({ windSpeed_mps: 6 }).warnings.join(' ')).toMatch(/ignores the wind/);
  });
});
