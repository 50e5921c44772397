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
export interface PackOnboarding extends PackItem {
  routes: { subsystem: string; progress: { done: number; total: number }; items: PackOnboardingItem[] }[];
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

/** What the worker keeps after an answer: the whole pack replaced, or the changes and removals folded in. */
export function applyPack(before: KeptPack | null, answer: PackAnswer, build: string, now: string): KeptPack {
  const groups = answer.full || !before ? emptyGroups() : structuredClone(before.groups);
  const removed = new Set(answer.removed.map((r) => r.url));
  for (const group of PACK_GROUPS) {
    const byUrl = new Map(groups[group].filter((i) => !removed.has(i.url)).map((i) => [i.url, i]));
    for (const item of answer[group]) byUrl.set(item.url, brief(item));
    groups[group] = [...byUrl.values()];
  }
  return { build, version: answer.version, refreshedAt: now, groups };
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
