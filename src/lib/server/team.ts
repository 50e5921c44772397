import { settings } from './config';
import { loadDemoTeam } from './demo/team';

let demoName: string | null = null;

/** The team's name for printouts: WAKEBOOK_TEAM_NAME, else the demo team's when the demo runs, else "Wakebook". */
export function teamName(): string {
  const s = settings();
  if (s.WAKEBOOK_TEAM_NAME) return s.WAKEBOOK_TEAM_NAME;
  if (s.WAKEBOOK_DEMO) {
    try {
      demoName ??= loadDemoTeam().team.name;
      return demoName;
    } catch {
      // The demo files are not shipped with every install; fall through to the plain name.
    }
  }
  return 'Wakebook';
}
