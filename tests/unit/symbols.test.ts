import { describe, expect, it } from 'vitest';
import { plainSymbols, symbolParts } from '../../src/lib/symbols';

describe('symbols with subscripts (K_T → K<sub>T</sub>)', () => {
  it('splits a symbol into its letter and its subscript', () => {
    expect(symbolParts('Thrust coefficient K_T')).toEqual([
      { text: 'Thrust coefficient K', sub: false },
      { text: 'T', sub: true },
    ]);
    expect(symbolParts('10·K_Q')).toEqual([
      { text: '10·K', sub: false },
      { text: 'Q', sub: true },
    ]);
  });
  it('reads several symbols, Greek letters, digits, comma-joined subscripts and a trailing superscript', () => {
    expect(symbolParts('Keller minimum A_E/A_0')).toEqual([
      { text: 'Keller minimum A', sub: false },
      { text: 'E', sub: true },
      { text: '/A', sub: false },
      { text: '0', sub: true },
    ]);
    expect(symbolParts('τ_c')).toEqual([
      { text: 'τ', sub: false },
      { text: 'c', sub: true },
    ]);
    expect(symbolParts('Lift coefficient C_Lβ')[1]).toEqual({ text: 'Lβ', sub: true });
    expect(symbolParts('−C_p,min')[1]).toEqual({ text: 'p,min', sub: true });
    expect(symbolParts('½ρV_R²')).toEqual([
      { text: '½ρV', sub: false },
      { text: 'R', sub: true },
      { text: '²', sub: false },
    ]);
  });
  it('leaves text without symbols whole, and an underscore not after a letter alone', () => {
    expect(symbolParts('Advance ratio J')).toEqual([{ text: 'Advance ratio J', sub: false }]);
    expect(symbolParts('')).toEqual([{ text: '', sub: false }]);
    expect(symbolParts('_x and 2_a')).toEqual([{ text: '_x and 2_a', sub: false }]);
  });
  it('leaves machine names alone: a longer name before the underscore is a field key or a file name', () => {
    for (const name of ['thrust_N', 'speed_mps', 'friction_factor', 'test_temperature.py::test_ross', 'Swamee_Jain'])
      expect(symbolParts(name)).toEqual([{ text: name, sub: false }]);
    expect(plainSymbols('fluids.friction (friction_factor), R_cell')).toBe('fluids.friction (friction_factor), Rcell');
  });
  it('plain text drops the underscore', () => {
    expect(plainSymbols('K_T and 10·K_Q')).toBe('KT and 10·KQ');
    expect(plainSymbols('A_E/A_0')).toBe('AE/A0');
    expect(plainSymbols('Advance ratio J')).toBe('Advance ratio J');
  });
});
