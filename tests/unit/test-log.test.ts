import { describe, expect, it } from 'vitest';
import { columnLabel, logColumn, unitConversion } from '../../src/lib/test-log';

describe('test-log column units from suffixes', () => {
  it('reads the usual suffixes', () => {
    expect(logColumn('speed_mps')).toEqual({ header: 'speed_mps', label: 'speed', unit: 'm/s' });
    expect(logColumn('power_W').unit).toBe('W');
    expect(logColumn('power_kW').unit).toBe('kW');
    expect(logColumn('boat_speed_kts').unit).toBe('kn');
    expect(logColumn('thrust_kN').unit).toBe('kN');
    expect(logColumn('coolant_in_C').unit).toBe('°C');
    expect(logColumn('time_s')).toMatchObject({ label: 'time', unit: 's' });
  });
  it('an unknown or missing suffix gives no unit, and the header stays the label', () => {
    expect(logColumn('lap')).toEqual({ header: 'lap', label: 'lap', unit: '' });
    expect(logColumn('note_xyz').unit).toBe('');
  });
  it('converts between units of one quantity (1 kn = 1852/3600 m/s by definition; 1 kW = 1000 W)', () => {
    expect(unitConversion('kn', 'm/s')!(10)).toBeCloseTo(5.144444, 6);
    expect(unitConversion('km/h', 'm/s')!(36)).toBeCloseTo(10, 12);
    expect(unitConversion('kW', 'W')!(1.5)).toBe(1500);
    expect(unitConversion('W', 'kW')!(1500)).toBe(1.5);
    expect(unitConversion('m/s', 'm/s')!(3)).toBe(3);
  });
  it('refuses to convert between different quantities', () => {
    expect(unitConversion('W', 'm/s')).toBeNull();
    expect(unitConversion('', 'W')).toBeNull();
  });
});

describe('readable column labels from CSV headers', () => {
  it('snake_case with a unit suffix becomes words and the unit in parentheses', () => {
    expect(columnLabel('thrust_N')).toBe('Thrust (N)');
    expect(columnLabel('speed_mps')).toBe('Speed (m/s)');
    expect(columnLabel('boat_speed_kts')).toBe('Boat speed (kn)');
    expect(columnLabel('power_kW')).toBe('Power (kW)');
    expect(columnLabel('power_kw')).toBe('Power (kW)');
    expect(columnLabel('coolant_in_C')).toBe('Coolant in (°C)');
    expect(columnLabel('motorTemp_C')).toBe('Motor temp (°C)');
    expect(columnLabel('time_s')).toBe('Time (s)');
    expect(columnLabel('rpm')).toBe('rpm');
  });
  it('a header without a known unit stays readable words, capitals kept', () => {
    expect(columnLabel('lap')).toBe('Lap');
    expect(columnLabel('lap_count')).toBe('Lap count');
    expect(columnLabel('note_xyz')).toBe('Note xyz');
    expect(columnLabel('SOC')).toBe('SOC');
    expect(columnLabel('GPS_fix')).toBe('GPS fix');
    expect(columnLabel('Speed (m/s)')).toBe('Speed (m/s)');
    expect(columnLabel('  ')).toBe('Unnamed column');
  });
});
