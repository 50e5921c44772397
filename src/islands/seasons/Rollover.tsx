import { useState } from 'react';
import { apiFetch, ApiError } from '~/lib/client/api';
import type { RolloverMember, Season } from '~/lib/schemas/seasons';

interface Change {
  userId: string;
  name: string;
  change: 'to-alumni' | 'continues';
  subsystems: string[];
}

export default function Rollover({
  seasons,
  members,
  current,
}: {
  seasons: Season[];
  members: RolloverMember[];
  current: string;
}) {
  const [target, setTarget] = useState(seasons[0]?.id ?? '');
  const [continuing, setContinuing] = useState<string[]>([]);
  const [preview, setPreview] = useState<{ from: string; to: string; changes: Change[] } | null>(null);
  const [error, setError] = useState('');
  const [done, setDone] = useState(false);
  if (seasons.length === 0) {
    return (
      <section className="card" aria-labelledby="roll-h">
        <h2 id="roll-h" className="text-lg font-semibold">
          Roll over to a new season
        </h2>
        <p className="mt-2 text-sm text-muted">Open the next season first; then roll the team over to it here.</p>
      </section>
    );
  }
  async function run(confirm: boolean) {
    setError('');
    try {
      const res = await apiFetch<{ applied: boolean; from: string; to: string; changes: Change[] }>(
        `/api/seasons/${target}/rollover`,
        { method: 'POST', json: { continuing, confirm } },
      );
      if (res.applied) setDone(true);
      else setPreview(res);
    } catch (e) {
      setError(e instanceof ApiError ? e.message : 'Could not reach the server.');
    }
  }
  if (done)
    return (
      <p className="card" role="status">
        Rolled over. <a href="/seasons">Reload the seasons</a>.
      </p>
    );
  return (
    <section className="card flex flex-col gap-3" aria-labelledby="roll-h">
      <h2 id="roll-h" className="text-lg font-semibold">
        Roll over to a new season
      </h2>
      <p className="text-sm text-muted">
        Members of {current} who do not continue become alumni: they keep reading and answering questions, but stop
        editing. Leads and advisors keep their roles.
      </p>
      <div className="field max-w-xs">
        <label htmlFor="roll-target">New current season</label>
        <select
          id="roll-target"
          className="input"
          value={target}
          onChange={(e) => {
            setTarget(e.target.value);
            setPreview(null);
          }}
        >
          {seasons.map((s) => (
            <option key={s.id} value={s.id}>
              {s.name}
            </option>
          ))}
        </select>
      </div>
      <fieldset>
        <legend className="mb-1 text-sm font-semibold">Who continues into the new season?</legend>
        <div className="grid gap-1 sm:grid-cols-2">
          {members.map((m) => (
            <label key={m.id} className="flex items-center gap-2 text-sm">
              <input
                type="checkbox"
                checked={continuing.includes(m.id)}
                onChange={() => {
                  setPreview(null);
                  setContinuing((c) => (c.includes(m.id) ? c.filter((x) => x !== m.id) : [...c, m.id]));
                }}
              />
              {m.name} <span className="text-muted">({m.subsystems.join(', ') || 'no subsystem'})</span>
            </label>
          ))}
        </div>
      </fieldset>
      {!preview && (
        <button type="button" className="btn btn-quiet self-start" onClick={() => run(false)}>
          Show exactly what will change
        </button>
      )}
      {preview && (
        <div className="notice flex flex-col gap-2" role="region" aria-label="What will change">
          <p className="font-semibold">
            Rolling over from {preview.from} to {preview.to} will:
          </p>
          <ul className="list-disc pl-5 text-sm">
            <li>make {preview.to} the current season;</li>
            {preview.changes.map((c) => (
              <li key={c.userId}>
                {c.change === 'to-alumni'
                  ? `move ${c.name} from member to alumni`
                  : `keep ${c.name} as a member in ${preview.to}${c.subsystems.length ? `, owning ${c.subsystems.join(', ')}` : ''}`}
                ;
              </li>
            ))}
            {preview.changes.length === 0 && <li>change nobody’s role (no members in {preview.from}).</li>}
          </ul>
          <div className="flex gap-2">
            <button type="button" className="btn btn-primary" onClick={() => run(true)}>
              Roll over now
            </button>
            <button type="button" className="btn btn-quiet" onClick={() => setPreview(null)}>
              Cancel
            </button>
          </div>
        </div>
      )}
      {error && (
        <p className="field-error" role="alert">
          {error}
        </p>
      )}
    </section>
  );
}
