import { useState, type FormEvent } from 'react';
import { apiFetch, ApiError } from '~/lib/client/api';

interface Season {
  id: string;
  name: string;
  startsOn: string;
  endsOn: string;
  phase: string;
  current: boolean;
}
interface Member {
  id: string;
  name: string;
  subsystems: string[];
}
interface Change {
  userId: string;
  name: string;
  change: 'to-alumni' | 'continues';
  subsystems: string[];
}

const PHASES = ['design', 'build', 'test', 'race', 'handover'];

/** Leads open seasons, move their phase, make one current, and roll the team over to a new season. */
export default function SeasonAdmin({ seasons, members }: { seasons: Season[]; members: Member[] }) {
  return (
    <div className="flex flex-col gap-8">
      <OpenSeason />
      <section aria-labelledby="phase-h" className="card flex flex-col gap-3">
        <h2 id="phase-h" className="text-lg font-semibold">Phase and current season</h2>
        {seasons.map((s) => <SeasonRow key={s.id} season={s} />)}
      </section>
      <Rollover seasons={seasons.filter((s) => !s.current)} members={members} current={seasons.find((s) => s.current)?.name ?? ''} />
    </div>
  );
}

function OpenSeason() {
  const [f, setF] = useState({ name: '', startsOn: '', endsOn: '', phase: 'design', boat: '' });
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [message, setMessage] = useState('');
  async function submit(e: FormEvent) {
    e.preventDefault();
    setErrors({});
    setMessage('');
    try {
      await apiFetch('/api/seasons', { method: 'POST', json: { ...f, boat: f.boat || undefined } });
      window.location.reload();
    } catch (err) {
      if (err instanceof ApiError) {
        setErrors(err.fieldErrors());
        setMessage(err.status === 409 ? err.message : err.status === 400 ? 'Some fields need attention.' : err.message);
      } else setMessage('Could not reach the server; try again.');
    }
  }
  const field = (k: keyof typeof f, label: string, type = 'text') => (
    <div className="field">
      <label htmlFor={`season-${k}`}>{label}</label>
      <input id={`season-${k}`} type={type} className="input" value={f[k]} onChange={(e) => setF({ ...f, [k]: e.target.value })}
        aria-invalid={errors[k] ? true : undefined} aria-describedby={errors[k] ? `season-${k}-error` : undefined} />
      {errors[k] && <p id={`season-${k}-error`} className="field-error">{errors[k]}</p>}
    </div>
  );
  return (
    <form onSubmit={submit} className="card flex flex-col gap-3" aria-labelledby="open-h" noValidate>
      <h2 id="open-h" className="text-lg font-semibold">Open a season</h2>
      {message && <p className="alert" role="alert">{message}</p>}
      <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-5">
        {field('name', 'Name (e.g. 2026–27)')}
        {field('startsOn', 'Starts', 'date')}
        {field('endsOn', 'Ends', 'date')}
        <div className="field">
          <label htmlFor="season-phase">Phase</label>
          <select id="season-phase" className="input" value={f.phase} onChange={(e) => setF({ ...f, phase: e.target.value })}>
            {PHASES.map((p) => <option key={p} value={p}>{p}</option>)}
          </select>
        </div>
        {field('boat', 'Boat (optional)')}
      </div>
      <button type="submit" className="btn btn-primary self-start">Open season</button>
    </form>
  );
}

function SeasonRow({ season }: { season: Season }) {
  const [phase, setPhase] = useState(season.phase);
  const [error, setError] = useState('');
  async function patch(body: object) {
    setError('');
    try {
      await apiFetch(`/api/seasons/${season.id}`, { method: 'PATCH', json: body });
      window.location.reload();
    } catch (e) {
      setError(e instanceof ApiError ? e.message : 'Could not reach the server.');
    }
  }
  return (
    <div className="flex flex-wrap items-end gap-3 border-b border-line pb-3 last:border-0">
      <p className="w-28 font-semibold">{season.name}{season.current && <span className="block text-xs font-normal text-muted">current</span>}</p>
      <div className="field">
        <label htmlFor={`phase-${season.id}`}>Phase of {season.name}</label>
        <select id={`phase-${season.id}`} className="input py-1" value={phase} onChange={(e) => setPhase(e.target.value)}>
          {PHASES.map((p) => <option key={p} value={p}>{p}</option>)}
        </select>
      </div>
      <button type="button" className="btn btn-quiet" disabled={phase === season.phase} onClick={() => patch({ phase })}>Move phase</button>
      {!season.current && <button type="button" className="btn btn-quiet" onClick={() => window.confirm(`Make ${season.name} the current season? Nobody's role changes; use the rollover below for that.`) && patch({ current: true })}>Make current</button>}
      {error && <p className="field-error" role="alert">{error}</p>}
    </div>
  );
}

function Rollover({ seasons, members, current }: { seasons: Season[]; members: Member[]; current: string }) {
  const [target, setTarget] = useState(seasons[0]?.id ?? '');
  const [continuing, setContinuing] = useState<string[]>([]);
  const [preview, setPreview] = useState<{ from: string; to: string; changes: Change[] } | null>(null);
  const [error, setError] = useState('');
  const [done, setDone] = useState(false);
  if (seasons.length === 0) {
    return (
      <section className="card" aria-labelledby="roll-h">
        <h2 id="roll-h" className="text-lg font-semibold">Roll over to a new season</h2>
        <p className="mt-2 text-sm text-muted">Open the next season first; then roll the team over to it here.</p>
      </section>
    );
  }
  async function run(confirm: boolean) {
    setError('');
    try {
      const res = await apiFetch<{ applied: boolean; from: string; to: string; changes: Change[] }>(`/api/seasons/${target}/rollover`, { method: 'POST', json: { continuing, confirm } });
      if (res.applied) setDone(true);
      else setPreview(res);
    } catch (e) {
      setError(e instanceof ApiError ? e.message : 'Could not reach the server.');
    }
  }
  if (done) return <p className="card" role="status">Rolled over. <a href="/seasons">Reload the seasons</a>.</p>;
  return (
    <section className="card flex flex-col gap-3" aria-labelledby="roll-h">
      <h2 id="roll-h" className="text-lg font-semibold">Roll over to a new season</h2>
      <p className="text-sm text-muted">Members of {current} who do not continue become alumni: they keep reading and answering questions, but stop editing. Leads and advisors keep their roles.</p>
      <div className="field max-w-xs">
        <label htmlFor="roll-target">New current season</label>
        <select id="roll-target" className="input" value={target} onChange={(e) => { setTarget(e.target.value); setPreview(null); }}>
          {seasons.map((s) => <option key={s.id} value={s.id}>{s.name}</option>)}
        </select>
      </div>
      <fieldset>
        <legend className="mb-1 text-sm font-semibold">Who continues into the new season?</legend>
        <div className="grid gap-1 sm:grid-cols-2">
          {members.map((m) => (
            <label key={m.id} className="flex items-center gap-2 text-sm">
              <input type="checkbox" checked={continuing.includes(m.id)} onChange={() => { setPreview(null); setContinuing((c) => (c.includes(m.id) ? c.filter((x) => x !== m.id) : [...c, m.id])); }} />
              {m.name} <span className="text-muted">({m.subsystems.join(', ') || 'no subsystem'})</span>
            </label>
          ))}
        </div>
      </fieldset>
      {!preview && <button type="button" className="btn btn-quiet self-start" onClick={() => run(false)}>Show exactly what will change</button>}
      {preview && (
        <div className="notice flex flex-col gap-2" role="region" aria-label="What will change">
          <p className="font-semibold">Rolling over from {preview.from} to {preview.to} will:</p>
          <ul className="list-disc pl-5 text-sm">
            <li>make {preview.to} the current season;</li>
            {preview.changes.map((c) => (
              <li key={c.userId}>{c.change === 'to-alumni' ? `move ${c.name} from member to alumni` : `keep ${c.name} as a member in ${preview.to}${c.subsystems.length ? `, owning ${c.subsystems.join(', ')}` : ''}`};</li>
            ))}
            {preview.changes.length === 0 && <li>change nobody’s role (no members in {preview.from}).</li>}
          </ul>
          <div className="flex gap-2">
            <button type="button" className="btn btn-primary" onClick={() => run(true)}>Roll over now</button>
            <button type="button" className="btn btn-quiet" onClick={() => setPreview(null)}>Cancel</button>
          </div>
        </div>
      )}
      {error && <p className="field-error" role="alert">{error}</p>}
    </section>
  );
}
