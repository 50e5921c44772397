import { lazy, Suspense, useState, type FormEvent } from 'react';
import { apiFetch, ApiError } from '~/lib/client/api';
import { SEASON_PHASES } from '~/lib/domain';
import type { RolloverMember, Season } from '~/lib/schemas/seasons';

/** Leads open seasons, move their phase, make one current, and roll the team over to a new season. */
export default function SeasonAdmin({ seasons, members }: { seasons: Season[]; members: RolloverMember[] }) {
  return (
    <div className="flex flex-col gap-8">
      <OpenSeason />
      <section aria-labelledby="phase-h" className="card flex flex-col gap-3">
        <h2 id="phase-h" className="text-lg font-semibold">
          Phase and current season
        </h2>
        {seasons.map((s) => (
          <SeasonRow key={s.id} season={s} />
        ))}
      </section>
      <RolloverLauncher
        seasons={seasons.filter((s) => !s.current)}
        members={members}
        current={seasons.find((s) => s.current)?.name ?? ''}
      />
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
      <input
        id={`season-${k}`}
        type={type}
        className="input"
        value={f[k]}
        onChange={(e) => setF({ ...f, [k]: e.target.value })}
        aria-invalid={errors[k] ? true : undefined}
        aria-describedby={errors[k] ? `season-${k}-error` : undefined}
      />
      {errors[k] && (
        <p id={`season-${k}-error`} className="field-error">
          {errors[k]}
        </p>
      )}
    </div>
  );
  return (
    <form onSubmit={submit} className="card flex flex-col gap-3" aria-labelledby="open-h" noValidate>
      <h2 id="open-h" className="text-lg font-semibold">
        Open a season
      </h2>
      {message && (
        <p className="alert" role="alert">
          {message}
        </p>
      )}
      <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-5">
        {field('name', 'Name (e.g. 2026–27)')}
        {field('startsOn', 'Starts', 'date')}
        {field('endsOn', 'Ends', 'date')}
        <div className="field">
          <label htmlFor="season-phase">Phase</label>
          <select
            id="season-phase"
            className="input"
            value={f.phase}
            onChange={(e) => setF({ ...f, phase: e.target.value })}
          >
            {SEASON_PHASES.map((p) => (
              <option key={p} value={p}>
                {p}
              </option>
            ))}
          </select>
        </div>
        {field('boat', 'Boat (optional)')}
      </div>
      <button type="submit" className="btn btn-primary self-start">
        Open season
      </button>
    </form>
  );
}

function SeasonRow({ season }: { season: Season }) {
  const [phase, setPhase] = useState<string>(season.phase);
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
      <p className="w-28 font-semibold">
        {season.name}
        {season.current && <span className="block text-xs font-normal text-muted">current</span>}
      </p>
      <div className="field">
        <label htmlFor={`phase-${season.id}`}>Phase of {season.name}</label>
        <select
          id={`phase-${season.id}`}
          className="input py-1"
          value={phase}
          onChange={(e) => setPhase(e.target.value)}
        >
          {SEASON_PHASES.map((p) => (
            <option key={p} value={p}>
              {p}
            </option>
          ))}
        </select>
      </div>
      <button
        type="button"
        className="btn btn-quiet"
        disabled={phase === season.phase}
        onClick={() => patch({ phase })}
      >
        Move phase
      </button>
      {!season.current && (
        <button
          type="button"
          className="btn btn-quiet"
          onClick={() =>
            window.confirm(
              `Make ${season.name} the current season? Nobody's role changes; use the rollover below for that.`,
            ) && patch({ current: true })
          }
        >
          Make current
        </button>
      )}
      {error && (
        <p className="field-error" role="alert">
          {error}
        </p>
      )}
    </div>
  );
}

// The rollover wizard is used once a year: its code loads only when a lead opens it.
const Rollover = lazy(() => import('./Rollover'));

function RolloverLauncher(props: { seasons: Season[]; members: RolloverMember[]; current: string }) {
  const [open, setOpen] = useState(false);
  if (!open) {
    return (
      <section className="card flex flex-col gap-2" aria-labelledby="roll-h">
        <h2 id="roll-h" className="text-lg font-semibold">
          Roll over to a new season
        </h2>
        <p className="text-sm text-muted">
          At the end of a season: choose who continues; everyone else in {props.current || 'the current season'} becomes
          alumni. You see exactly what will change before anything does.
        </p>
        <button type="button" className="btn btn-quiet self-start" onClick={() => setOpen(true)}>
          Start the rollover…
        </button>
      </section>
    );
  }
  return (
    <Suspense fallback={<p className="card text-sm text-muted">Loading the rollover…</p>}>
      <Rollover {...props} />
    </Suspense>
  );
}
