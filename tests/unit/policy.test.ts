import { describe, it, expect } from 'vitest';
import type { Role } from '../../src/lib/domain';
import { can, ALL_ACTIONS, type Action } from '../../src/lib/policy';

// The permissions of PRODUCT.md ("People and roles"), written out in full so a change to the policy
// shows up here as a deliberate edit. C = only for the current season's work.
const Y = true;
const N = false;
const C = 'current' as const;
/** Only their own work, and only in the current season. */
const O = 'own' as const;
type Cell = boolean | typeof C | typeof O;
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
  'record:edit': { lead: Y, advisor: N, member: C, alumni: N },
  'record:status': { lead: Y, advisor: N, member: C, alumni: N },
  'record:review': { lead: Y, advisor: Y, member: N, alumni: N },
  'record:comment': { lead: Y, advisor: Y, member: Y, alumni: Y },
  'attachment:upload': { lead: Y, advisor: N, member: C, alumni: N },
  'calculation:create': { lead: Y, advisor: N, member: C, alumni: N },
  'calculation:recompute': { lead: Y, advisor: N, member: C, alumni: N },
  'calculation:edit': { lead: Y, advisor: N, member: O, alumni: N },
  'onboarding:curate': { lead: Y, advisor: Y, member: N, alumni: N },
  'onboarding:follow': { lead: Y, advisor: Y, member: Y, alumni: Y },
  'onboarding:see-all': { lead: Y, advisor: N, member: N, alumni: N },
};
const ROLES: Role[] = ['lead', 'advisor', 'member', 'alumni'];

describe('policy: every role × action', () => {
  it('covers every action the policy knows', () => {
    expect(Object.keys(EXPECTED).sort()).toEqual([...ALL_ACTIONS].sort());
  });

  for (const action of ALL_ACTIONS) {
    for (const role of ROLES) {
      const cell = EXPECTED[action][role];
      const may =
        cell === C ? 'may, in the current season only,' : cell === O ? 'may, own work this season only,' : 'may';
      it(`${role} ${cell ? may : 'may not'} ${action}`, () => {
        if (cell === O) {
          expect(can({ role }, action, { seasonIsCurrent: true, isAuthor: true })).toBe(true);
          expect(can({ role }, action, { seasonIsCurrent: true, isAuthor: false })).toBe(false);
          expect(can({ role }, action, { seasonIsCurrent: false, isAuthor: true })).toBe(false);
          expect(can({ role }, action, { seasonIsCurrent: true })).toBe(false);
        } else if (cell === C) {
          expect(can({ role }, action, { seasonIsCurrent: true })).toBe(true);
          expect(can({ role }, action, { seasonIsCurrent: false })).toBe(false);
          expect(can({ role }, action)).toBe(false);
        } else {
          expect(can({ role }, action, { seasonIsCurrent: true })).toBe(cell);
          expect(can({ role }, action, { seasonIsCurrent: false, isAuthor: false })).toBe(cell);
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
