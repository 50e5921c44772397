import { lazy, Suspense, useState } from 'react';
import OpenSeason from './OpenSeason';
import { apiFetch, ApiError } from '~/lib/client/api';
import { SEASON_PHASES } from '~/lib/domain';
import type { RolloverMember, Season } from '~/lib/schemas/seasons';

/** Leads open seasons, move their phase, make one current, and roll the team over to a new season. */
export default function SeasonAdmin({ seasons, members }: { seasons: Season[]; members: RolloverMember[] }) {
  const current = seasons.find((s) => s.current);
  return (
    <div className="flex flex-col gap-8">
      <OpenSeason />
      <section aria-labelledby="phase-h" className="card flex flex-col gap-3">
        <h2 id="phase-h" className="text-lg font-semibold">
          Phase and current season
        </h2>
        {seasons.map((s) => (
          <SeasonRow key={s.id} season={s} past={!!current && s.startsOn < current.startsOn} />
        ))}
      </section>
      <RolloverLauncher
        seasons={seasons.filter((s) => !!current && s.startsOn > current.startsOn)}
        members={members}
        current={current}
      />
    </div>
  );
}

function SeasonRow({ season, past }: { season: Season; past: boolean }) {
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
      {past && <span className="text-sm text-muted">Earlier than the current season</span>}
      {!season.current && !past && (
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

function RolloverLauncher(props: { seasons: Season[]; members: RolloverMember[]; current: Season | undefined }) {
  const [open, setOpen] = useState(false);
  if (!open) {
    return (
      <section className="card flex flex-col gap-2" aria-labelledby="roll-h">
        <h2 id="roll-h" className="text-lg font-semibold">
          Roll over to a new season
        </h2>
        <p className="text-sm text-muted">
          At the end of a season: choose who continues; everyone else in {props.current?.name ?? 'the current season'}{' '}
          becomes alumni. You see exactly what will change before anything does.
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
