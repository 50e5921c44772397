// What each role may do, written once. Pages, API routes and islands all ask `can`.
// Pure: no server imports, so islands can hide controls the server would refuse anyway.
import type { Role } from './domain';

export const ROLE_LABELS: Record<Role, string> = {
  lead: 'Lead',
  advisor: 'Advisor',
  member: 'Member',
  alumni: 'Alumni',
};

export type Action =
  | 'read' // everything that is not admin: guides, records, calculations, people directory
  | 'season:manage'
  | 'subsystem:manage'
  | 'people:manage'
  | 'invitation:manage'
  | 'audit:read'
  | 'export:run'
  | 'outbox:read'
  | 'digest:send'
  | 'record:create'
  | 'record:import' // bring documents in as draft records (members: into the current season)
  | 'record:edit'
  | 'record:status'
  | 'record:accept' // a decision: accept it (a member needs a review of the current version first; see records/write.ts)
  | 'record:withdraw' // a decision: withdraw it
  | 'record:discard' // a draft: delete it for good
  | 'record:review'
  | 'record:comment'
  | 'question:mark-answered'
  | 'attachment:upload'
  | 'calculation:create'
  | 'calculation:recompute'
  | 'calculation:edit' // rename, re-note, move to another subsystem, delete
  | 'onboarding:curate'
  | 'onboarding:follow'
  | 'onboarding:see-all'
  | 'onboarding:nudge'
  | 'guide:review'
  | 'guide:suggest'
  | 'guide:triage';

/** What the rule needs to know about the thing acted on. */
export interface Subject {
  /** The record or calculation belongs to the current season. */
  seasonIsCurrent?: boolean;
  /** The caller wrote the record or calculation, or asked the question (or wrote the record it is on). */
  isOwn?: boolean;
}

type Rule = boolean | ((subject: Subject) => boolean);
const currentSeasonOnly: Rule = (s) => s.seasonIsCurrent === true;
const ownOnly: Rule = (s) => s.isOwn === true;
const ownInCurrentSeason: Rule = (s) => s.seasonIsCurrent === true && s.isOwn === true;

const POLICY: Record<Role, Partial<Record<Action, Rule>>> = {
  lead: {}, // leads may do everything; see can()
  advisor: {
    read: true,
    // Advisors decide on decisions (accept, withdraw) but never write their text.
    'record:accept': true,
    'record:withdraw': true,
    'record:review': true,
    'record:comment': true,
    'question:mark-answered': true,
    'onboarding:curate': true,
    'onboarding:follow': true,
    'guide:review': true,
    'guide:suggest': true,
    'guide:triage': true,
  },
  member: {
    read: true,
    'record:create': true,
    'record:import': currentSeasonOnly,
    'record:edit': currentSeasonOnly,
    'record:status': currentSeasonOnly,
    'record:accept': currentSeasonOnly,
    'record:withdraw': currentSeasonOnly,
    'record:discard': ownOnly,
    'record:comment': true,
    'question:mark-answered': ownOnly,
    'attachment:upload': currentSeasonOnly,
    'calculation:create': currentSeasonOnly,
    'calculation:recompute': currentSeasonOnly,
    'calculation:edit': ownInCurrentSeason,
    'onboarding:follow': true,
    'guide:suggest': true,
  },
  alumni: {
    read: true,
    'record:comment': true,
    'question:mark-answered': ownOnly,
    'onboarding:follow': true,
    'guide:suggest': true,
  },
};

export interface Actor {
  role: Role;
}

export function can(user: Actor | null | undefined, action: Action, subject: Subject = {}): boolean {
  if (!user) return false;
  if (user.role === 'lead') return true;
  const rule = POLICY[user.role]?.[action];
  if (rule === undefined || rule === false) return false;
  return rule === true ? true : rule(subject);
}

export const ALL_ACTIONS: Action[] = [
  'read',
  'season:manage',
  'subsystem:manage',
  'people:manage',
  'invitation:manage',
  'audit:read',
  'export:run',
  'outbox:read',
  'digest:send',
  'record:create',
  'record:import',
  'record:edit',
  'record:status',
  'record:accept',
  'record:withdraw',
  'record:discard',
  'record:review',
  'record:comment',
  'question:mark-answered',
  'attachment:upload',
  'calculation:create',
  'calculation:recompute',
  'calculation:edit',
  'onboarding:curate',
  'onboarding:follow',
  'onboarding:see-all',
  'onboarding:nudge',
  'guide:review',
  'guide:suggest',
  'guide:triage',
];
