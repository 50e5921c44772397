// A seeded generator of trade-like documents for the search benchmark. Word ranks follow a two-regime Zipf law
// (frequency ∝ 1/r up to rank 5,000 and ∝ 1/r² beyond, the shape Ferrer i Cancho & Solé (2001) report for large
// English corpora), so the vocabulary keeps growing with the corpus the way real writing does (Heaps' law with
// β ≈ 0.5 from the 1/r² tail). The most common ranks are function words and the trade's own words; rarer ranks are
// made-up words built from syllables, unique per rank.

export function mulberry32(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = Math.imul(a ^ (a >>> 15), 1 | a);
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

const FUNCTION_WORDS = (
  'the of and to a in is for with on at by we it was that this as be are from or not but have has had were which ' +
  'when then so if into than after before our its they one two all more no only also out up down over under'
).split(' ');

const TRADE_WORDS = (
  'propeller hull battery cell controller motor shaft seal coolant pump radiator cable fuse connector contactor ' +
  'busbar voltage current power energy efficiency thrust torque drag resistance speed rpm pitch diameter blade ' +
  'ventilation cavitation wake hydrofoil foil rudder steering throttle telemetry logger sensor temperature ' +
  'thermistor heatsink inverter mppt panel array irradiance module solar charge discharge balancing bms pack ' +
  'string series parallel insulation crimp lug gland bearing coupling gearbox pod strut transom keel chine deck ' +
  'laminate sandwich core epoxy carbon glass resin mould layup fairing gelcoat sealant fastener bracket mount ' +
  'race endurance sprint slalom scrutineering rules marshal launch trailer dock pontoon lake river harbour ' +
  'season handover decision lesson review test trial data log calibration firmware wiring harness loom ' +
  'ground earth isolation kill cord switch relay precharge capacitor ripple filter noise shield antenna radio ' +
  'weight ballast trim stability buoyancy displacement waterline wetted area friction viscosity density ' +
  'flow pressure leak hose clamp reservoir inlet outlet pickup weed strainer pipe tube manifold valve ' +
  'cooling heat loss margin budget estimate measure model simulation sweep compare recompute calculation'
).split(' ');

const INFLECTIONS = ['', 's', 'ing'];
const CONSONANTS = 'bcdfghjklmnprstvwxz';
const VOWELS = 'aeiouy';
// Every syllable is two letters, so a word reads back to exactly one sequence of syllables: ranks never collide.
const SYLLABLES = [...CONSONANTS].flatMap((c) => [...VOWELS].map((v) => c + v));
const BASE_WORDS = [...FUNCTION_WORDS, ...INFLECTIONS.flatMap((s) => TRADE_WORDS.map((w) => w + s))];

export function wordForRank(rank: number): string {
  if (rank < BASE_WORDS.length) return BASE_WORDS[rank];
  let n = rank - BASE_WORDS.length + SYLLABLES.length ** 2; // at least three syllables, like most content words
  let w = '';
  while (n > 0) {
    w = SYLLABLES[n % SYLLABLES.length] + w;
    n = Math.floor(n / SYLLABLES.length);
  }
  return w;
}

const HEAD = 5000;
const HEAD_MASS = Math.log(HEAD);
const TAIL_MASS = 1; // ∫ HEAD/r² dr from HEAD to ∞
const P_HEAD = HEAD_MASS / (HEAD_MASS + TAIL_MASS);

/** A word rank (0 is the most common) drawn by inverse transform of the continuous two-regime law. */
export function zipfRank(rand: () => number): number {
  const u = rand();
  if (u < P_HEAD) return Math.floor(Math.exp((u / P_HEAD) * HEAD_MASS)) - 1;
  return Math.floor(HEAD / (1 - (u - P_HEAD) / (1 - P_HEAD))) - 1;
}

export interface BenchDoc {
  type: 'decision' | 'lesson' | 'calculation' | 'guide';
  title: string;
  body: string;
  subsystem: string;
}

const SUBSYSTEMS = ['hull', 'propulsion', 'cooling', 'battery', 'solar', 'steering', 'telemetry', 'general'];
const TYPES: BenchDoc['type'][] = ['decision', 'decision', 'lesson', 'lesson', 'calculation', 'guide'];
const UNITS = ['V', 'A', 'W', 'Wh', 'mm', 'm', 'rpm', '°C', 'kg', 'N'];

function contentRank(rand: () => number): number {
  // Titles and queries use content words: skip the function words at the head of the law.
  for (;;) {
    const r = zipfRank(rand);
    if (r >= FUNCTION_WORDS.length) return r;
  }
}

export function* generateCorpus(count: number, seed = 6): Generator<BenchDoc> {
  const rand = mulberry32(seed);
  for (let i = 0; i < count; i++) {
    const titleWords = 4 + Math.floor(rand() * 6);
    const title: string[] = [];
    for (let k = 0; k < titleWords; k++) title.push(wordForRank(contentRank(rand)));
    title[0] = title[0][0].toUpperCase() + title[0].slice(1);
    const words = 300 + Math.floor(rand() * 501);
    const body: string[] = [];
    let sentence = 0;
    for (let k = 0; k < words; k++) {
      if (rand() < 0.03) body.push(`${Math.round(rand() * 1000) / 10} ${UNITS[Math.floor(rand() * UNITS.length)]}`);
      else body.push(wordForRank(zipfRank(rand)));
      if (++sentence >= 8 + Math.floor(rand() * 13)) {
        body[body.length - 1] += '.';
        sentence = 0;
      }
    }
    yield {
      type: TYPES[i % TYPES.length],
      title: title.join(' '),
      body: body.join(' '),
      subsystem: SUBSYSTEMS[i % SUBSYSTEMS.length],
    };
  }
}

/** One edit a person might make: a letter dropped, doubled, swapped with its neighbour, or replaced. */
export function typo(word: string, rand: () => number): string {
  const i = 1 + Math.floor(rand() * (word.length - 2));
  const kind = Math.floor(rand() * 4);
  if (kind === 0) return word.slice(0, i) + word.slice(i + 1);
  if (kind === 1) return word.slice(0, i) + word[i] + word.slice(i);
  if (kind === 2) return word.slice(0, i) + word[i + 1] + word[i] + word.slice(i + 2);
  const letters = 'abcdefghijklmnopqrstuvwxyz';
  let c = word[i];
  while (c === word[i]) c = letters[Math.floor(rand() * letters.length)];
  return word.slice(0, i) + c + word.slice(i + 1);
}

export interface BenchQuery {
  q: string;
  shape: 'exact' | 'prefix' | 'typo';
  /** For a typo: the word before the typo, and after. */
  intended?: string;
  misspelt?: string;
}

/**
 * 1–3 content words from the corpus's own law; a third end with a prefix of 3–6 letters (typing), a third carry
 * one typo in a word of six letters or more.
 */
export function generateQueries(count: number, seed = 66): BenchQuery[] {
  const rand = mulberry32(seed);
  const out: BenchQuery[] = [];
  for (let i = 0; i < count; i++) {
    const n = 1 + Math.floor(rand() * 3);
    const words: string[] = [];
    for (let k = 0; k < n; k++) words.push(wordForRank(contentRank(rand)));
    let shape: BenchQuery['shape'] = (['exact', 'prefix', 'typo'] as const)[i % 3];
    let intended: string | undefined;
    let misspelt: string | undefined;
    if (shape === 'prefix') {
      const last = words[n - 1];
      words[n - 1] = last.slice(0, Math.min(last.length, 3 + Math.floor(rand() * 4)));
    } else if (shape === 'typo') {
      const k = words.findIndex((w) => w.length >= 6);
      if (k >= 0) {
        intended = words[k];
        words[k] = typo(words[k], rand);
        misspelt = words[k];
      } else shape = 'exact';
    }
    out.push({ q: words.join(' '), shape, ...(intended ? { intended, misspelt } : {}) });
  }
  return out;
}
