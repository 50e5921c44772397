import { useState } from 'react';
import { apiFetch, ApiError } from '~/lib/client/api';
import type { RolloverMember, Season } from '~/lib/schemas/seasons';
import { rolloverSentences, type RolloverPreviewChange } from '~/lib/rollover-text';
import OpenSeason from './OpenSeason';

interface Preview {
  from: string;
  to: string;
  changes: RolloverPreviewChange[];
}

/** The day after `date` (YYYY-MM-DD), and a year on: the dates a following season most likely has. */
function following(date: string | undefined) {
  if (!date) return {};
  const d = new Date(`${date}T00:00:00Z`);
  d.setUTCDate(d.getUTCDate() + 1);
  const start = d.toISOString().slice(0, 10);
  d.setUTCFullYear(d.getUTCFullYear() + 1);
  d.setUTCDate(d.getUTCDate() - 1);
  const end = d.toISOString().slice(0, 10);
  // named the way seasons are: the years it spans, "2026–27" (one year alone when it starts on 1 January)
  const [y0, y1] = [start.slice(0, 4), end.slice(0, 4)];
  return { name: y0 === y1 ? y0 : `${y0}–${y1.slice(2)}`, startsOn: start, endsOn: end };
}

/**
 * Rolls the team over to a season that starts after the current one (the server refuses any other). Every member
 * of the current season starts ticked as continuing; the lead unticks those who leave.
 */
export default function Rollover({
  seasons: later,
  members,
  current,
}: {
  seasons: Season[];
  members: RolloverMember[];
  current: Season | undefined;
}) {
  const [seasons, setSeasons] = useState(later);
  const [target, setTarget] = useState(later[0]?.id ?? '');
  const [continuing, setContinuing] = useState<string[]>(() => members.map((m) => m.id));
  const [preview, setPreview] = useState<Preview | null>(null);
  const [error, setError] = useState('');
  const [done, setDone] = useState(false);
  if (!current) {
    return (
      <section className="card" aria-labelledby="roll-h">
        <h2 id="roll-h" className="text-lg font-semibold">
          Roll over to a new season
        </h2>
        <p className="mt-2 text-sm text-muted">No season is current, so there is nothing to roll over from.</p>
      </section>
    );
  }
  if (seasons.length === 0) {
    return (
      <section className="flex flex-col gap-3" aria-labelledby="roll-h">
        <h2 id="roll-h" className="text-lg font-semibold">
          Roll over to a new season
        </h2>
        <p className="text-sm text-muted">
          No season starts after {current.name} yet. Open the next one here; the rollover continues with it.
        </p>
        <OpenSeason
          idPrefix="next-season"
          title="Open the next season"
          initial={following(current.endsOn)}
          onOpened={(s) => {
            setSeasons([s]);
            setTarget(s.id);
          }}
        />
      </section>
    );
  }
  async function run(confirm: boolean) {
    setError('');
    try {
      const res = await apiFetch<Preview & { applied: boolean }>(`/api/seasons/${target}/rollover`, {
        method: 'POST',
        json: { continuing, confirm },
      });
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
        Members of {current.name} who do not continue become alumni: they keep reading and answering questions, but stop
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
              {s.name} (from {s.startsOn})
            </option>
          ))}
        </select>
      </div>
      <fieldset>
        <legend className="mb-1 text-sm font-semibold">Who continues into the new season?</legend>
        {members.length === 0 && <p className="text-sm text-muted">{current.name} has no members.</p>}
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
            Rolling over from {preview.from} to {preview.to}:
          </p>
          {rolloverSentences(preview.from, preview.to, preview.changes).map((line) => (
            <p key={line} className="text-sm">
              {line}
            </p>
          ))}
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
