import { describe, it, expect } from 'vitest';
import { unitFromName } from '../../src/lib/units';
import { calculators } from '../../src/lib/calc';

describe('unitFromName: units from name suffixes, as calculators name fields', () => {
  it('reads the suffixes of the issue: _C → °C, _mps → m/s, _s → s', () => {
    expect(unitFromName('motor_C')).toEqual({ label: 'Motor', unit: '°C' });
    expect(unitFromName('boatSpeed_mps')).toEqual({ label: 'Boat speed', unit: 'm/s' });
    expect(unitFromName('time_s')).toEqual({ label: 'Time', unit: 's' });
  });

  it('tells kelvin from °C and metres from millimetres, and keeps acronyms', () => {
    expect(unitFromName('coolantRise_K').unit).toBe('K');
    expect(unitFromName('pipeBore_mm').unit).toBe('mm');
    expect(unitFromName('length_m').unit).toBe('m');
    expect(unitFromName('SOC_pct')).toEqual({ label: 'SOC', unit: '%' });
    expect(unitFromName('pack current_A')).toEqual({ label: 'Pack current', unit: 'A' });
  });

  it('leaves names without a known suffix whole', () => {
    expect(unitFromName('rpm')).toEqual({ label: 'rpm', unit: '' });
    expect(unitFromName('note_xyz')).toEqual({ label: 'note_xyz', unit: '' });
    expect(unitFromName('_C')).toEqual({ label: '_C', unit: '' });
  });

  it('agrees with the unit every calculator gives its own suffixed inputs and outputs', () => {
    let checked = 0;
    for (const calc of Object.values(calculators))
      for (const f of [...calc.inputs, ...calc.outputs]) {
        const { unit } = unitFromName(f.name);
        if (!unit) continue;
        expect(unit, `${calc.kind}.${f.name}`).toBe(f.unit);
        checked++;
      }
    expect(checked).toBeGreaterThan(30);
  });
});
