import { useEffect, useMemo, useState } from 'react';
import LineChart from '../ui/LineChart';
import { parseCsv, numericColumns } from '~/lib/csv';
import { unitFromName } from '~/lib/units';
import { columnLabel } from '~/lib/test-log';

/** Plots a CSV test log: pick the x column and the columns to draw against it. */
export default function CsvPreview({ url, name }: { url: string; name: string }) {
  const [text, setText] = useState<string | null>(null);
  const [error, setError] = useState('');
  // What the person picked; until then the first numeric column runs along x and the next two are drawn.
  const [xPicked, setX] = useState<number | null>(null);
  const [ysPicked, setYs] = useState<number[] | null>(null);

  useEffect(() => {
    fetch(url, { credentials: 'same-origin' })
      .then((r) => (r.ok ? r.text() : Promise.reject(new Error(`HTTP ${r.status}`))))
      .then(setText)
      .catch(() => setError('Could not load the log.'));
  }, [url]);

  const table = useMemo(() => (text ? parseCsv(text, 20_000) : null), [text]);
  const numeric = useMemo(() => (table ? numericColumns(table) : []), [table]);
  const x = xPicked ?? numeric[0] ?? 0;
  const ys = ysPicked ?? numeric.slice(1, 3);

  if (error) return <p className="text-sm text-muted">{error}</p>;
  if (!table) return <p className="text-sm text-muted">Loading {name}…</p>;
  if (numeric.length < 2)
    return <p className="text-sm text-muted">This file has fewer than two numeric columns to plot.</p>;

  const col = (i: number) => table.rows.map((r) => Number(r[i]));
  // Columns named the way calculators name fields carry their unit: motor_C → °C, speed_mps → m/s, time_s → s.
  const axis = (i: number) => ({ name: table.header[i], ...unitFromName(table.header[i]), values: col(i) });
  const set = { title: name, x: axis(x), y: ys.map(axis) };
  const id = `csv-${name.replace(/\W+/g, '-')}`;
  return (
    <div className="flex flex-col gap-2">
      <div className="csv-controls flex flex-wrap items-end gap-4 text-sm">
        <div className="field">
          <label htmlFor={`${id}-x`}>Along (x)</label>
          <select
            id={`${id}-x`}
            className="input py-1"
            value={x}
            onChange={(e) => {
              const next = Number(e.target.value);
              setX(next);
              setYs(ys.filter((i) => i !== next));
            }}
          >
            {numeric.map((i) => (
              <option key={i} value={i} title={table.header[i]}>
                {columnLabel(table.header[i])}
              </option>
            ))}
          </select>
        </div>
        <fieldset className="flex flex-wrap gap-3">
          <legend className="mb-1 font-semibold">Plot</legend>
          {numeric
            .filter((i) => i !== x)
            .map((i) => (
              <label key={i} className="flex items-center gap-1" title={table.header[i]}>
                <input
                  type="checkbox"
                  checked={ys.includes(i)}
                  onChange={() => setYs(ys.includes(i) ? ys.filter((k) => k !== i) : [...ys, i])}
                />
                {columnLabel(table.header[i])}
              </label>
            ))}
        </fieldset>
      </div>
      {ys.length > 0 ? (
        <LineChart
          datasets={[{ set }]}
          height={260}
          title={`${name}: ${table.rows.length} rows${table.truncated ? ' (first 20,000 shown)' : ''}`}
        />
      ) : (
        <p className="text-sm text-muted">Tick a column to plot.</p>
      )}
    </div>
  );
}
