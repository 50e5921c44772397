import { useState, type FormEvent } from 'react';
import { apiFetch, ApiError } from '~/lib/client/api';
import { SEASON_PHASES } from '~/lib/domain';
import type { Season } from '~/lib/schemas/seasons';

/** Opens a season; by default the page reloads, the rollover instead takes the new season in place. */
export default function OpenSeason({
  idPrefix = 'season',
  onOpened = () => window.location.reload(),
  title = 'Open a season',
  initial = {},
}: {
  onOpened?: (season: Season) => void;
  title?: string;
  idPrefix?: string;
  initial?: Partial<Record<'name' | 'startsOn' | 'endsOn', string>>;
}) {
  const [f, setF] = useState({ name: '', startsOn: '', endsOn: '', phase: 'design', boat: '', ...initial });
  const idp = idPrefix;
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [message, setMessage] = useState('');
  async function submit(e: FormEvent) {
    e.preventDefault();
    setErrors({});
    setMessage('');
    try {
      const res = await apiFetch<{ season: Season }>('/api/seasons', {
        method: 'POST',
        json: { ...f, boat: f.boat || undefined },
      });
      onOpened(res.season);
    } catch (err) {
      if (err instanceof ApiError) {
        setErrors(err.fieldErrors());
        setMessage(err.status === 409 ? err.message : err.status === 400 ? 'Some fields need attention.' : err.message);
      } else setMessage('Could not reach the server; try again.');
    }
  }
  const field = (k: keyof typeof f, label: string, type = 'text') => (
    <div className="field">
      <label htmlFor={`${idp}-${k}`}>{label}</label>
      <input
        id={`${idp}-${k}`}
        type={type}
        className="input"
        value={f[k]}
        onChange={(e) => setF({ ...f, [k]: e.target.value })}
        aria-invalid={errors[k] ? true : undefined}
        aria-describedby={errors[k] ? `${idp}-${k}-error` : undefined}
      />
      {errors[k] && (
        <p id={`${idp}-${k}-error`} className="field-error">
          {errors[k]}
        </p>
      )}
    </div>
  );
  return (
    <form onSubmit={submit} className="card flex flex-col gap-3" aria-labelledby={`${idp}-open-h`} noValidate>
      <h2 id={`${idp}-open-h`} className="text-lg font-semibold">
        {title}
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
          <label htmlFor={`${idp}-phase`}>Phase</label>
          <select
            id={`${idp}-phase`}
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
