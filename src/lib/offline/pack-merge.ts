// The offline pack as the API sends it (GET /api/offline/pack, built by lib/server/offline-pack.ts) and how the
// service worker folds an answer into what it already keeps. Pure: no I/O, no clock.
import { PACK_GROUPS, type KeptPack, type PackGroup, type PackItem } from './names';

export interface PackGuide extends PackItem {
  slug: string;
  subsystem: string;
}
export interface PackRecord extends PackItem {
  id: string;
  kind: 'decision' | 'lesson';
  subsystem: string;
  season: string;
  status: string;
}
export interface PackCalculation extends PackItem {
  id: string;
  kind: string;
  subsystem: string;
  season: string;
}
export interface PackCalculator extends PackItem {
  kind: string;
}
export interface PackOnboardingItem {
  id: string;
  kind: 'guide' | 'record' | 'calculation';
  title: string;
  url: string | null;
  done: boolean;
}
/** One subsystem's onboarding route with the caller's progress; its page is the subsystem's page. */
export interface PackOnboarding extends PackItem {
  subsystem: string;
  progress: { done: number; total: number };
  items: PackOnboardingItem[];
}

/** One answer of GET /api/offline/pack. With `?since=`, only what changed since that version, plus `removed`. */
export interface PackAnswer {
  version: string;
  person: string;
  /** True when this answer is the whole pack (no `since`, or a `since` from before the caller's scope changed). */
  full: boolean;
  scope: { rule: 'memberships' | 'all'; subsystems: string[] };
  guides: PackGuide[];
  records: PackRecord[];
  calculations: PackCalculation[];
  calculators: PackCalculator[];
  onboarding: PackOnboarding[];
  removed: { id: string; url: string }[];
}

const emptyGroups = (): Record<PackGroup, PackItem[]> =>
  Object.fromEntries(PACK_GROUPS.map((g) => [g, []])) as unknown as Record<PackGroup, PackItem[]>;

const brief = ({ url, title, updatedAt }: PackItem): PackItem => ({ url, title, updatedAt });

/**
 * What the worker keeps after an answer — the whole pack replaced, or the changes and removals folded in — and the
 * page addresses to drop: those removed, and on a whole answer those the pack no longer holds.
 */
export function applyPack(
  before: KeptPack | null,
  answer: PackAnswer,
  build: string,
  now: string,
): { pack: KeptPack; dropped: string[] } {
  const groups = answer.full || !before ? emptyGroups() : structuredClone(before.groups);
  const removed = new Set(answer.removed.map((r) => r.url));
  for (const group of PACK_GROUPS) {
    const byUrl = new Map(groups[group].filter((i) => !removed.has(i.url)).map((i) => [i.url, i]));
    for (const item of answer[group]) byUrl.set(item.url, brief(item));
    groups[group] = [...byUrl.values()];
  }
  const held = new Set(PACK_GROUPS.flatMap((g) => groups[g].map((i) => i.url)));
  const earlier = before ? PACK_GROUPS.flatMap((g) => before.groups[g].map((i) => i.url)) : [];
  const dropped = new Set([...removed, ...earlier.filter((url) => !held.has(url))]);
  return { pack: { build, version: answer.version, refreshedAt: now, groups }, dropped: [...dropped] };
}

/**
 * The page addresses to fetch now, newest first: everything in the pack that is not kept yet, and everything this
 * answer says has changed.
 */
export function pagesToWarm(pack: KeptPack, answer: PackAnswer, kept: Set<string>): string[] {
  const changed = new Set(PACK_GROUPS.flatMap((g) => answer[g].map((i) => i.url)));
  return PACK_GROUPS.flatMap((g) => pack.groups[g])
    .filter((i) => changed.has(i.url) || !kept.has(i.url))
    .sort((a, b) => b.updatedAt.localeCompare(a.updatedAt))
    .map((i) => i.url);
}
