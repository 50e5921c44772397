// The people and URLs of the multi-person loads: extra accounts written straight into the bench's own database
// (before its server starts) with the demo member's password and a membership in the current season, and the
// reads a team spreads over a working day: records, record pages, subsystem hubs, lists, searches, calculations.
import Database from 'better-sqlite3';
import { randomBytes } from 'node:crypto';

export const BENCH_PEOPLE = 20;

/** Adds BENCH_PEOPLE members to the database file; returns every email that can sign in with the demo password. */
export function addBenchPeople(file: string): string[] {
  const sqlite = new Database(file);
  try {
    const member = sqlite.prepare(`select password_hash from users where email = 'member@wakebook.test'`).get() as
      { password_hash: string } | undefined;
    const season = sqlite.prepare('select id from seasons where is_current = 1').get() as { id: string } | undefined;
    if (!member || !season) throw new Error('bench: the demo seed is missing its member or current season');
    const addUser = sqlite.prepare(
      `insert or ignore into users (id, email, name, role, password_hash, digest_opt_in, created_at)
       values (?, ?, ?, 'member', ?, 0, ?)`,
    );
    const addMembership = sqlite.prepare(
      `insert or ignore into season_memberships (id, season_id, user_id, role)
       select ?, ?, id, 'member' from users where email = ?`,
    );
    const emails: string[] = [];
    sqlite.transaction(() => {
      for (let i = 1; i <= BENCH_PEOPLE; i++) {
        const email = `bench.member${i}@wakebook.test`;
        addUser.run(randomId(), email, `Bench Member ${i}`, member.password_hash, Date.now());
        addMembership.run(randomId(), season.id, email);
        emails.push(email);
      }
    })();
    return ['member@wakebook.test', 'lead@wakebook.test', 'advisor@wakebook.test', ...emails];
  } finally {
    sqlite.close();
  }
}

/** GET paths of the mixed load (every one must answer 200 to every bench person). */
export function benchReadPaths(file: string): string[] {
  const sqlite = new Database(file, { readonly: true });
  try {
    const ids = (sql: string) => (sqlite.prepare(sql).all() as { id: string }[]).map((r) => r.id);
    const current = ids(
      'select r.id from records r join seasons s on s.id = r.season_id where s.is_current = 1 and r.deleted_at is null order by r.id limit 10',
    );
    const older = ids(
      'select r.id from records r join seasons s on s.id = r.season_id where s.is_current = 0 and r.deleted_at is null order by r.id limit 4',
    );
    const calcs = ids('select id from calculations order by id limit 6');
    const subsystems = (sqlite.prepare('select slug from subsystems order by slug').all() as { slug: string }[]).map(
      (r) => r.slug,
    );
    return [
      '/',
      '/records',
      '/records?status=open',
      '/subsystems',
      '/calculations',
      '/guides',
      '/people',
      '/search?q=propeller',
      '/search?q=coolant%20loop',
      ...current.map((id) => `/records/${id}`),
      ...older.slice(0, 2).map((id) => `/records/${id}`),
      ...subsystems.map((slug) => `/subsystems/${slug}`),
      ...calcs.slice(0, 3).map((id) => `/calculations/${id}`),
      ...current.slice(0, 5).map((id) => `/api/records/${id}`),
      ...older.slice(2).map((id) => `/api/records/${id}`),
      '/api/records?limit=25',
      ...calcs.slice(3).map((id) => `/api/calculations/${id}`),
      '/api/search?q=propeller',
      '/api/search?q=venti',
      '/api/search?q=batery',
      '/api/subsystems',
      '/api/me',
    ];
  } finally {
    sqlite.close();
  }
}

/** Current-season records that the load's writes comment on (a member may comment on any record). */
export function benchWriteTargets(file: string): string[] {
  const sqlite = new Database(file, { readonly: true });
  try {
    return (
      sqlite
        .prepare(
          'select r.id from records r join seasons s on s.id = r.season_id where s.is_current = 1 and r.deleted_at is null order by r.id',
        )
        .all() as { id: string }[]
    ).map((r) => `/api/records/${r.id}/comments`);
  } finally {
    sqlite.close();
  }
}

function randomId(): string {
  return randomBytes(8).toString('hex');
}
