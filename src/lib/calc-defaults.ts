// What the save form proposes for each calculator kind: the subsystem it usually belongs to and a title hint.
// Kinds added later fall back to plain wording; a team whose subsystems have other slugs is matched by name. Pure.

interface KindDefaults {
  /** Subsystem slugs to try, in order. */
  slugs: string[];
  /** Words to look for in subsystem names when no slug matches. */
  words: RegExp;
  /** Title hint for the save form. */
  example: string;
}

const HULL: Omit<KindDefaults, 'example'> = { slugs: ['hull'], words: /hull|foil/i };
const PROPULSION: Omit<KindDefaults, 'example'> = { slugs: ['propulsion'], words: /propul|motor|drive/i };
const BATTERY: Omit<KindDefaults, 'example'> = { slugs: ['battery', 'energy'], words: /battery|energy/i };

const DEFAULTS: Record<string, KindDefaults> = {
  water: { ...HULL, example: 'Lake water on race day, 16 °C' },
  resistance: { ...HULL, example: 'Hull at endurance pace, fresh water' },
  planing: { ...HULL, example: 'Hull planing at sprint speed' },
  foil: { ...HULL, example: 'Main foil at take-off speed' },
  propeller: { ...PROPULSION, example: 'Endurance propeller at race pace' },
  'propeller-sweep': { ...PROPULSION, example: 'Sweep of three-blade propellers for the new pod' },
  race: { ...PROPULSION, example: 'Endurance race on the full pack' },
  sprint: { ...PROPULSION, example: 'Sprint start with the sprint propeller' },
  solar: { slugs: ['solar'], words: /solar|array|panel/i, example: 'Deck array at noon in June' },
  energy: { ...BATTERY, example: 'Energy budget for the two-hour endurance race' },
  battery: { ...BATTERY, example: 'Pack of 14 cells in series at race current' },
  cable: { ...BATTERY, example: 'Main battery cable, 80 A over 2 m' },
  cooling: { slugs: ['cooling'], words: /cool|thermal/i, example: 'Controller cold plate at full power' },
};

/** The subsystem a new calculation of this kind is filed under unless the person chooses another. */
export function defaultSubsystemFor(kind: string, subsystems: { slug: string; name: string }[]): string | undefined {
  const d = DEFAULTS[kind];
  if (!d) return undefined;
  for (const slug of d.slugs) if (subsystems.some((s) => s.slug === slug)) return slug;
  return subsystems.find((s) => d.words.test(s.name))?.slug;
}

/** The title field's placeholder for this kind: an example title, never a real calculation. */
export function titlePlaceholderFor(kind: string, calculatorTitle: string): string {
  const d = DEFAULTS[kind];
  return `e.g. ${d ? d.example : `${calculatorTitle}: what was checked, and for which race`}`;
}
