// The audit log's actions in words. Pure, so the page and the API answer say the same thing.

const WORDS: Record<string, string> = {
  'auth.sign-in': 'signed in',
  'auth.sign-in-failed': 'failed to sign in',
  'auth.sign-in-throttled': 'was held back after repeated failed sign-ins',
  'auth.reset-request': 'asked for a password reset',
  'auth.reset-throttled': 'was held back after repeated reset requests',
  'auth.password-reset': 'reset their password',
  'account.digest': 'changed their digest setting',
  'invitation.create': 'invited',
  'invitation.resend': 'sent the invitation again to',
  'invitation.revoke': 'withdrew the invitation of',
  'invitation.accept': 'accepted the invitation and joined as',
  'person.role-change': 'changed the role of',
  'person.subsystems': 'changed the subsystems of',
  'record.create': 'wrote',
  'record.update': 'edited',
  'record.status': 'changed the status of',
  'record.review': 'reviewed',
  'record.comment': 'commented on',
  'record.attachment': 'attached a file to',
  'record.delete': 'deleted',
  'calculation.create': 'saved the calculation',
  'calculation.recompute': 'recomputed',
  'calculation.update': 'changed',
  'calculation.delete': 'deleted the calculation',
  'season.create': 'opened the season',
  'season.update': 'changed the season',
  'season.make-current': 'made current',
  'season.rollover': 'rolled the team over to',
  'subsystem.create': 'added the subsystem',
  'subsystem.update': 'changed the subsystem',
  'guide.review': 'reviewed the guide',
  'guide.suggest': 'suggested a change to',
  'guide.suggestion': 'decided on a suggestion for',
  'onboarding.route': 'rearranged the onboarding route of',
  'onboarding.nudge': 'nudged',
  'export.run': 'downloaded the handover bundle',
  'backup.run': 'downloaded a backup',
  'digest.send': 'sent the digest',
  'demo.seed': 'seeded the demo team',
};

/** "signed in", "wrote", … — the dotted action name itself when it has no words yet. */
export function actionInWords(action: string): string {
  return WORDS[action] ?? action.replace(/[.:-]/g, ' ');
}
