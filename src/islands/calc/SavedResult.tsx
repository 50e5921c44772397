import { useMemo, useState, useSyncExternalStore } from 'react';
import { getCalculator } from '~/lib/calc';
import type { Grid, SeriesSet } from '~/lib/calc/types';
import { operatingPoints } from '~/lib/chart-marks';
import { apiFetch, ApiError } from '~/lib/client/api';
import { formatQuantity } from '~/lib/format';
import LineChart from '../ui/LineChart';
import Sym from '../ui/Sym';
import GridTable from './GridTable';

const noSubscription = () => () => {};

type Outputs = Record<string, number | string | null>;

export interface SavedResultData {
  outputs: Outputs;
  warnings: string[];
  series: Record<string, SeriesSet> | null;
  grid: Grid | null;
  grids: Grid[];
  engineVersion: string;
}

interface Change {
  name: string;
  before: unknown;
  after: unknown;
}

/**
 * A saved calculation's latest result: outputs, warnings, charts and grid. When today's engine differs from the
 * one that computed it (and the person may), it offers to recompute, and shows the new result in place, with
 * what changed; the earlier result stays in the history.
 */
export default function SavedResult({
  id,
  kind,
  inputs,
  initial,
  currentEngineVersion,
  canRecompute,
}: {
  id: string;
  kind: string;
  inputs: Record<string, unknown>;
  initial: SavedResultData;
  currentEngineVersion: string | null;
  canRecompute: boolean;
}) {
  const calc = getCalculator(kind);
  const [result, setResult] = useState(initial);
  const [state, setState] = useState<'idle' | 'busy' | 'done' | 'error'>('idle');
  const [changes, setChanges] = useState<Change[]>([]);
  const [message, setMessage] = useState('');
  // The server-rendered button stays disabled until this island can act on a click.
  const ready = useSyncExternalStore(
    noSubscription,
    () => true,
    () => false,
  );

  const meta = useMemo(() => new Map((calc?.outputs ?? []).map((o) => [o.name, o])), [calc]);
  const charts = useMemo(
    () =>
      Object.values(result.series ?? {}).map((set) => ({
        datasets: [{ set }],
        marks: operatingPoints(set, result.outputs, inputs),
      })),
    [result, inputs],
  );
  const stale = currentEngineVersion !== null && currentEngineVersion !== result.engineVersion;
  const show = (name: string, v: unknown) => {
    const m = meta.get(name);
    const q = formatQuantity(v, m?.unit ?? '', m?.digits ?? 3);
    return q.unit ? `${q.value} ${q.unit}` : q.value;
  };

  async function recompute() {
    setState('busy');
    setMessage('');
    try {
      const res = await apiFetch<{
        changes: Change[];
        calculation: SavedResultData;
      }>(`/api/calculations/${id}/recompute`, { method: 'POST' });
      const c = res.calculation;
      setResult({
        outputs: c.outputs,
        warnings: c.warnings,
        series: c.series,
        grid: c.grid,
        grids: c.grids,
        engineVersion: c.engineVersion,
      });
      setChanges(res.changes);
      setMessage(`Recomputed with engine ${c.engineVersion}; the earlier result is kept in the history.`);
      setState('done');
    } catch (e) {
      setMessage(e instanceof ApiError ? e.message : 'Could not reach the server; try again.');
      setState('error');
    }
  }

  return (
    <div className="flex min-w-0 flex-col gap-6" data-testid="saved-result">
      {stale && (
        <div className="notice flex flex-col gap-2" role="note">
          <p>
            Computed with engine {result.engineVersion}; today’s engine is {currentEngineVersion}.{' '}
            {canRecompute
              ? 'Recompute to see whether anything changed.'
              : 'A member of its season or a lead can recompute it.'}
          </p>
          {canRecompute && (
            <button
              type="button"
              className="btn btn-quiet no-print self-start"
              onClick={recompute}
              disabled={!ready || state === 'busy'}
            >
              {state === 'busy' ? 'Recomputing…' : 'Recompute with today’s engine'}
            </button>
          )}
        </div>
      )}
      <div aria-live="polite" className="empty:hidden">
        {message && <p className={state === 'error' ? 'alert' : 'text-sm'}>{message}</p>}
        {state === 'done' && changes.length === 0 && <p className="text-sm text-muted">No output changed.</p>}
        {state === 'done' && changes.length > 0 && (
          <table className="tabular mt-2 border-collapse text-sm">
            <caption className="text-left font-semibold">What changed</caption>
            <thead>
              <tr>
                <th scope="col" className="pr-3 text-left">
                  Output
                </th>
                <th scope="col" className="pr-3 text-right">
                  Before
                </th>
                <th scope="col" className="text-right">
                  Now
                </th>
              </tr>
            </thead>
            <tbody>
              {changes.map((c) => (
                <tr key={c.name}>
                  <th scope="row" className="pr-3 text-left font-medium">
                    {meta.has(c.name) ? <Sym text={meta.get(c.name)?.label ?? ''} /> : c.name}
                  </th>
                  <td className="pr-3 text-right">{show(c.name, c.before)}</td>
                  <td className="text-right">{show(c.name, c.after)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
      </div>
      <section aria-labelledby="out-h">
        <h2 id="out-h" className="mb-2 text-lg font-semibold">
          Outputs <span className="text-sm font-normal text-muted">(engine {result.engineVersion})</span>
        </h2>
        <table className="tabular w-full border-collapse text-sm" data-testid="outputs">
          <tbody>
            {Object.entries(result.outputs).map(([name, v]) => {
              const m = meta.get(name);
              const q = formatQuantity(v, m?.unit ?? '', m?.digits ?? 3);
              return (
                <tr key={name} className="border-b border-line">
                  <th scope="row" className="py-1.5 pr-3 text-left font-medium">
                    {m ? <Sym text={m.label} /> : name}
                  </th>
                  <td className="py-1.5 text-right font-semibold" data-output={name}>
                    {q.value}
                  </td>
                  <td className="w-20 py-1.5 pl-2 text-muted">{q.unit}</td>
                </tr>
              );
            })}
          </tbody>
        </table>
      </section>
      {result.warnings.length > 0 && (
        <ul className="notice flex flex-col gap-1 text-sm" aria-label="Warnings">
          {result.warnings.map((w) => (
            <li key={w}>
              <span aria-hidden="true">⚠ </span>
              <Sym text={w} />
            </li>
          ))}
        </ul>
      )}
      {charts.map((c, i) => (
        <LineChart key={`${result.engineVersion}-${i}`} datasets={c.datasets} marks={c.marks} />
      ))}
      {result.grid && <GridTable grid={result.grid} />}
      {result.grids.map((g) => (
        <GridTable key={g.title} grid={g} />
      ))}
    </div>
  );
}
