import { describe, it, expect } from 'vitest';
import type { Role } from '../../src/lib/domain';
import { can, ALL_ACTIONS, type Action } from '../../src/lib/policy';

// The permissions of PRODUCT.md ("People and roles"), written out in full so a change to the policy
// shows up here as a deliberate edit. C = only for the current season's work; O = only one's own (the question
// one asked, or one on a record one wrote).
const Y = true;
const N = false;
const C = 'current' as const;
const O = 'own' as const;
/** Only their own work, and only in the current season. */
const OC = 'own-current' as const;
type Cell = boolean | typeof C | typeof O | typeof OC;
const EXPECTED: Record<Action, Record<Role, Cell>> = {
  read: { lead: Y, advisor: Y, member: Y, alumni: Y },
  'season:manage': { lead: Y, advisor: N, member: N, alumni: N },
  'subsystem:manage': { lead: Y, advisor: N, member: N, alumni: N },
  'people:manage': { lead: Y, advisor: N, member: N, alumni: N },
  'invitation:manage': { lead: Y, advisor: N, member: N, alumni: N },
  'audit:read': { lead: Y, advisor: N, member: N, alumni: N },
  'export:run': { lead: Y, advisor: N, member: N, alumni: N },
  'outbox:read': { lead: Y, advisor: N, member: N, alumni: N },
  'digest:send': { lead: Y, advisor: N, member: N, alumni: N },
  'record:create': { lead: Y, advisor: N, member: Y, alumni: N },
  'record:import': { lead: Y, advisor: N, member: C, alumni: N },
  'record:edit': { lead: Y, advisor: N, member: C, alumni: N },
  'record:status': { lead: Y, advisor: N, member: C, alumni: N },
  // Advisors accept and withdraw decisions; a member's acceptance also needs a review (tests/api/record-acceptance).
  'record:accept': { lead: Y, advisor: Y, member: C, alumni: N },
  'record:withdraw': { lead: Y, advisor: Y, member: C, alumni: N },
  'record:discard': { lead: Y, advisor: N, member: O, alumni: N },
  'record:review': { lead: Y, advisor: Y, member: N, alumni: N },
  'record:comment': { lead: Y, advisor: Y, member: Y, alumni: Y },
  'question:mark-answered': { lead: Y, advisor: Y, member: O, alumni: O },
  'attachment:upload': { lead: Y, advisor: N, member: C, alumni: N },
  'calculation:create': { lead: Y, advisor: N, member: C, alumni: N },
  'calculation:recompute': { lead: Y, advisor: N, member: C, alumni: N },
  'calculation:edit': { lead: Y, advisor: N, member: OC, alumni: N },
  'onboarding:curate': { lead: Y, advisor: Y, member: N, alumni: N },
  'onboarding:follow': { lead: Y, advisor: Y, member: Y, alumni: Y },
  'onboarding:see-all': { lead: Y, advisor: N, member: N, alumni: N },
  'onboarding:nudge': { lead: Y, advisor: N, member: N, alumni: N },
  'guide:review': { lead: Y, advisor: Y, member: N, alumni: N },
  'guide:suggest': { lead: Y, advisor: Y, member: Y, alumni: Y },
  'guide:triage': { lead: Y, advisor: Y, member: N, alumni: N },
};
const ROLES: Role[] = ['lead', 'advisor', 'member', 'alumni'];

describe('policy: every role × action', () => {
  it('covers every action the policy knows', () => {
    expect(Object.keys(EXPECTED).sort()).toEqual([...ALL_ACTIONS].sort());
  });

  for (const action of ALL_ACTIONS) {
    for (const role of ROLES) {
      const cell = EXPECTED[action][role];
      const how =
        cell === C
          ? 'may, in the current season only,'
          : cell === O
            ? 'may, for their own only,'
            : cell === OC
              ? 'may, own work this season only,'
              : cell
                ? 'may'
                : 'may not';
      it(`${role} ${how} ${action}`, () => {
        if (cell === O) {
          expect(can({ role }, action, { isOwn: true })).toBe(true);
          expect(can({ role }, action, { isOwn: false, seasonIsCurrent: true })).toBe(false);
          expect(can({ role }, action)).toBe(false);
        } else if (cell === OC) {
          expect(can({ role }, action, { seasonIsCurrent: true, isOwn: true })).toBe(true);
          expect(can({ role }, action, { seasonIsCurrent: true, isOwn: false })).toBe(false);
          expect(can({ role }, action, { seasonIsCurrent: false, isOwn: true })).toBe(false);
          expect(can({ role }, action, { seasonIsCurrent: true })).toBe(false);
        } else if (cell === C) {
          expect(can({ role }, action, { seasonIsCurrent: true })).toBe(true);
          expect(can({ role }, action, { seasonIsCurrent: false })).toBe(false);
          expect(can({ role }, action)).toBe(false);
        } else {
          expect(can({ role }, action, { seasonIsCurrent: true })).toBe(cell);
          expect(can({ role }, action, { seasonIsCurrent: false, isOwn: false })).toBe(cell);
        }
      });
    }
  }

  it('refuses everything to the signed-out', () => {
    for (const action of ALL_ACTIONS) {
      expect(can(null, action)).toBe(false);
      expect(can(undefined, action, { seasonIsCurrent: true })).toBe(false);
    }
  });

  it('refuses an unknown role instead of throwing', () => {
    expect(can({ role: 'captain' as Role }, 'read')).toBe(false);
  });
});
