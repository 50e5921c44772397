// Handover readiness: how much of what the next cohort needs a subsystem has left behind this season.
// Pure: the server gathers the facts, this scores them, so the rule is one readable, tested function.

export interface ReadinessFacts {
  /** Calculators apply to this subsystem: accepted decisions are then expected to link a calculation. */
  calculationsApply: boolean;
  acceptedDecisions: { id: string; title: string; reasoningWords: number; calculations: number }[];
  lessons: { id: string; title: string; status: string; onRoute: boolean }[];
  route: { items: number; itemsFromSeason: number; missingItems: number };
  guides: { slug: string; title: string; reviewedOn: string }[];
}

export interface ReadinessCheck {
  key: 'decisions' | 'lessons' | 'route' | 'guides';
  label: string;
  weight: number;
  /** 0..1 */
  fraction: number;
  missing: string[];
}

export interface Readiness {
  score: number;
  checks: ReadinessCheck[];
  missing: string[];
  has: {
    acceptedDecisions: number;
    decisionsComplete: number;
    lessons: number;
    lessonsHandled: number;
    routeItems: number;
    guides: number;
    guidesReviewed: number;
  };
}

/** A decision "has its reasoning" when its text says enough to be understood without its author (common practice). */
export const MIN_REASONING_WORDS = 80;
export const ROUTE_MIN_ITEMS = 3;
const YEAR_MS = 365.25 * 24 * 3600 * 1000;

const WEIGHTS = { decisions: 35, lessons: 20, route: 20, guides: 25 } as const;

export function scoreReadiness(f: ReadinessFacts, now: Date): Readiness {
  const checks: ReadinessCheck[] = [];

  const needsCalculation = f.calculationsApply;
  const complete = f.acceptedDecisions.filter(
    (d) => d.reasoningWords >= MIN_REASONING_WORDS && (!needsCalculation || d.calculations > 0),
  );
  const decisionMissing: string[] = [];
  if (f.acceptedDecisions.length === 0) decisionMissing.push('No accepted decision recorded this season.');
  for (const d of f.acceptedDecisions) {
    const gaps = [
      d.reasoningWords < MIN_REASONING_WORDS ? `its reasoning (${d.reasoningWords} words)` : '',
      needsCalculation && d.calculations === 0 ? 'a linked calculation' : '',
    ].filter(Boolean);
    if (gaps.length) decisionMissing.push(`Decision “${d.title}” needs ${gaps.join(' and ')}.`);
  }
  checks.push({
    key: 'decisions',
    label: needsCalculation
      ? 'Each accepted decision has its reasoning and a linked calculation'
      : 'Each accepted decision has its reasoning (no calculator applies to this subsystem)',
    weight: WEIGHTS.decisions,
    fraction: f.acceptedDecisions.length ? complete.length / f.acceptedDecisions.length : 0,
    missing: decisionMissing,
  });

  const open = f.lessons.filter((l) => l.status === 'open');
  const handled = f.lessons.filter((l) => l.status === 'addressed' || l.onRoute);
  checks.push({
    key: 'lessons',
    label: 'Open lessons are addressed or handed on (on the onboarding route)',
    weight: WEIGHTS.lessons,
    fraction: f.lessons.length ? handled.length / f.lessons.length : 1,
    missing: open
      .filter((l) => !l.onRoute)
      .map((l) => `Lesson “${l.title}” is open: address it or put it on the onboarding route.`),
  });

  const routeMissing: string[] = [];
  if (f.route.items < ROUTE_MIN_ITEMS)
    routeMissing.push(
      `The onboarding route has ${f.route.items} item${f.route.items === 1 ? '' : 's'}; give it at least ${ROUTE_MIN_ITEMS}.`,
    );
  if (f.route.items > 0 && f.route.itemsFromSeason === 0)
    routeMissing.push('The onboarding route has nothing from this season yet.');
  if (f.route.missingItems > 0)
    routeMissing.push(`${f.route.missingItems} onboarding item(s) point at something that no longer exists.`);
  const routeParts = [f.route.items >= ROUTE_MIN_ITEMS, f.route.itemsFromSeason > 0, f.route.missingItems === 0];
  checks.push({
    key: 'route',
    label: 'The onboarding route is current',
    weight: WEIGHTS.route,
    fraction: f.route.items === 0 ? 0 : routeParts.filter(Boolean).length / routeParts.length,
    missing: routeMissing,
  });

  const fresh = f.guides.filter((g) => now.getTime() - Date.parse(g.reviewedOn) <= YEAR_MS);
  const guideMissing =
    f.guides.length === 0
      ? ['No guide covers this subsystem.']
      : f.guides
          .filter((g) => !fresh.includes(g))
          .map((g) => `Guide “${g.title}” was last reviewed on ${g.reviewedOn}, over a year ago.`);
  checks.push({
    key: 'guides',
    label: 'Its guides were reviewed within the year',
    weight: WEIGHTS.guides,
    fraction: f.guides.length ? fresh.length / f.guides.length : 0,
    missing: guideMissing,
  });

  const score = Math.round(checks.reduce((s, c) => s + c.weight * c.fraction, 0));
  return {
    score,
    checks,
    missing: checks.flatMap((c) => c.missing),
    has: {
      acceptedDecisions: f.acceptedDecisions.length,
      decisionsComplete: complete.length,
      lessons: f.lessons.length,
      lessonsHandled: handled.length,
      routeItems: f.route.items,
      guides: f.guides.length,
      guidesReviewed: fresh.length,
    },
  };
}
