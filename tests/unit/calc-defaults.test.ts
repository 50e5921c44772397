import { describe, it, expect } from 'vitest';
import { defaultSubsystemFor, titlePlaceholderFor } from '../../src/lib/calc-defaults';
import { calculatorKinds, calculators } from '../../src/lib/calc';

const TEAM = [
  { slug: 'hull', name: 'Hull and foils' },
  { slug: 'propulsion', name: 'Propulsion and motor drive' },
  { slug: 'cooling', name: 'Cooling' },
  { slug: 'battery', name: 'Battery and energy' },
  { slug: 'solar', name: 'Solar array' },
  { slug: 'steering', name: 'Steering and controls' },
];

describe('defaultSubsystemFor: the save form files each kind where it belongs', () => {
  it('solar → solar array, cable → battery, cooling → cooling (issue 14)', () => {
    expect(defaultSubsystemFor('solar', TEAM)).toBe('solar');
    expect(defaultSubsystemFor('cable', TEAM)).toBe('battery');
    expect(defaultSubsystemFor('cooling', TEAM)).toBe('cooling');
    expect(defaultSubsystemFor('energy', TEAM)).toBe('battery');
    expect(defaultSubsystemFor('propeller', TEAM)).toBe('propulsion');
    expect(defaultSubsystemFor('resistance', TEAM)).toBe('hull');
  });

  it('matches by name when a team uses other slugs, and proposes nothing it cannot find', () => {
    const other = [
      { slug: 'pv', name: 'PV panels and trackers' },
      { slug: 'hv', name: 'Battery pack' },
    ];
    expect(defaultSubsystemFor('cable', other)).toBe('hv');
    expect(defaultSubsystemFor('cooling', other)).toBeUndefined();
    expect(defaultSubsystemFor('a-kind-from-next-year', TEAM)).toBeUndefined();
  });

  it('has a subsystem for every calculator the app has today', () => {
    for (const kind of calculatorKinds) expect(defaultSubsystemFor(kind, TEAM), kind).toBeDefined();
  });
});

describe('titlePlaceholderFor', () => {
  it('gives each kind an example of its own, and new kinds a plain one', () => {
    expect(titlePlaceholderFor('solar', 'Solar array output')).toMatch(/^e\.g\. .*array/i);
    expect(titlePlaceholderFor('cable', 'Cable')).toMatch(/cable/i);
    const hints = calculatorKinds.map((k) => titlePlaceholderFor(k, calculators[k].title));
    expect(new Set(hints).size).toBe(hints.length);
    expect(titlePlaceholderFor('sail', 'Sail force')).toBe('e.g. Sail force: what was checked, and for which race');
  });
});
