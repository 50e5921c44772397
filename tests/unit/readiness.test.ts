import { describe, it, expect } from 'vitest';
import { scoreReadiness, MIN_REASONING_WORDS, type ReadinessFacts } from '../../src/lib/readiness';

const NOW = new Date('2026-12-01T00:00:00Z');
const complete: ReadinessFacts = {
  calculationsApply: true,
  acceptedDecisions: [{ id: 'd1', title: 'Two propellers', reasoningWords: 300, calculations: 2 }],
  lessons: [{ id: 'l1', title: 'Ventilation', status: 'addressed', onRoute: false }],
  route: { items: 5, itemsFromSeason: 2, missingItems: 0 },
  guides: [{ slug: 'g', title: 'Reading the diagram', reviewedOn: '2026-10-01' }],
};

describe('scoreReadiness', () => {
  it('scores 100 with nothing missing when every check is met', () => {
    const r = scoreReadiness(complete, NOW);
    expect(r.score).toBe(100);
    expect(r.missing).toEqual([]);
    expect(r.checks.map((c) => c.weight).reduce((a, b) => a + b)).toBe(100);
  });

  it('scores 0 for a subsystem with nothing handed over, and says what is missing', () => {
    const r = scoreReadiness(
      {
        calculationsApply: true,
        acceptedDecisions: [],
        lessons: [],
        route: { items: 0, itemsFromSeason: 0, missingItems: 0 },
        guides: [],
      },
      NOW,
    );
    // Lessons count as handled when there are none to hand on (20 points); everything else is missing.
    expect(r.score).toBe(20);
    expect(r.missing).toContain('No accepted decision recorded this season.');
    expect(r.missing).toContain('No guide covers this subsystem.');
    expect(r.missing.some((m) => m.startsWith('The onboarding route has 0 items'))).toBe(true);
  });

  it('does not ask for a linked calculation where no calculator applies (a per-subsystem setting)', () => {
    const noCalc = {
      ...complete,
      acceptedDecisions: [{ id: 'd1', title: 'Rudder stock', reasoningWords: 300, calculations: 0 }],
    };
    const applies = scoreReadiness(noCalc, NOW);
    expect(applies.missing).toEqual(['Decision “Rudder stock” needs a linked calculation.']);
    expect(applies.score).toBe(65);
    const exempt = scoreReadiness({ ...noCalc, calculationsApply: false }, NOW);
    expect(exempt.missing).toEqual([]);
    expect(exempt.score).toBe(100);
    expect(exempt.checks[0].label).toMatch(/no calculator applies/);
    const thin = scoreReadiness(
      {
        ...noCalc,
        calculationsApply: false,
        acceptedDecisions: [{ id: 'd', title: 'T', reasoningWords: 5, calculations: 0 }],
      },
      NOW,
    );
    expect(thin.missing).toEqual(['Decision “T” needs its reasoning (5 words).']);
  });

  it('names a decision without reasoning or calculation and takes its share off', () => {
    const r = scoreReadiness(
      {
        ...complete,
        acceptedDecisions: [
          ...complete.acceptedDecisions,
          { id: 'd2', title: 'Thin one', reasoningWords: MIN_REASONING_WORDS - 1, calculations: 0 },
        ],
      },
      NOW,
    );
    expect(r.score).toBe(Math.round(100 - 35 / 2));
    expect(r.missing).toEqual(['Decision “Thin one” needs its reasoning (79 words) and a linked calculation.']);
  });

  it('an open lesson on the onboarding route counts as handed on; one off the route is missing', () => {
    const on = scoreReadiness(
      { ...complete, lessons: [{ id: 'l', title: 'Open but handed on', status: 'open', onRoute: true }] },
      NOW,
    );
    expect(on.score).toBe(100);
    const off = scoreReadiness(
      { ...complete, lessons: [{ id: 'l', title: 'Forgotten', status: 'open', onRoute: false }] },
      NOW,
    );
    expect(off.score).toBe(80);
    expect(off.missing[0]).toMatch(/Forgotten/);
  });

  it('guides reviewed more than a year ago lower the score', () => {
    const r = scoreReadiness(
      { ...complete, guides: [...complete.guides, { slug: 'old', title: 'Old guide', reviewedOn: '2025-05-20' }] },
      NOW,
    );
    expect(r.score).toBe(Math.round(100 - 25 / 2));
    expect(r.missing[0]).toContain('Old guide');
  });

  it('a short route, one with nothing from this season, or with dangling items is not current', () => {
    const r = scoreReadiness({ ...complete, route: { items: 2, itemsFromSeason: 0, missingItems: 1 } }, NOW);
    expect(r.checks.find((c) => c.key === 'route')!.fraction).toBe(0);
    expect(r.missing.filter((m) => /onboarding/.test(m))).toHaveLength(3);
  });
});
