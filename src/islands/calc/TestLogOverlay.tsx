import { useEffect, useId, useMemo, useState } from 'react';
import LineChart, { type ChartDataset } from '../ui/LineChart';
import Sym from '../ui/Sym';
import { plainSymbols } from '~/lib/symbols';
import { apiFetch, ApiError } from '~/lib/client/api';
import { numericColumns, parseCsv, type CsvTable } from '~/lib/csv';
import { formatNumber } from '~/lib/format';
import { readableWords } from '~/lib/units';
import { columnLabel, logColumn, unitConversion } from '~/lib/test-log';
import type { SeriesSet } from '~/lib/calc/types';

export interface OverlayLog {
  attachmentId: string;
  url: string;
  fileName: string;
  recordId: string;
  recordTitle: string;
  recordUrl: string;
  recordVersion: number;
  recordCalculationIds: string[];
  /** whether the viewer may add a calculation link to the record */
  canLink: boolean;
}

interface FitResult {
  formFactor: number;
  rSquared: number | null;
  residuals: { speed_mps: number; power_W: number; predicted_W: number; residual_W: number }[];
  inputs: Record<string, unknown> | null;
  warnings: string[];
}

const MAX_ROWS = 20_000;

/**
 * Draws a CSV test log, attached to a record that links this calculation, over the calculation's curves: the person
 * picks the columns, units come from the header suffixes and are converted to the curve's units. For hull
 * resistance it also fits the form factor to logged speed and electrical power and can save the fitted run.
 */
export default function TestLogOverlay({
  kind,
  title,
  subsystem,
  inputs,
  series,
  logs,
  canSave,
}: {
  kind: string;
  title: string;
  subsystem: string;
  inputs: Record<string, unknown>;
  series: SeriesSet[];
  logs: OverlayLog[];
  canSave: boolean;
}) {
  const uid = useId();
  const [logIndex, setLogIndex] = useState(0);
  const log = logs[logIndex];

  if (logs.length === 0)
    return (
      <p className="text-sm text-muted">
        No CSV test log is attached to a record that links this calculation. Attach a log to a linked decision record or
        lesson, with units as header suffixes (for example <code>speed_mps</code>, <code>power_W</code>,{' '}
        <code>thrust_N</code>), to draw it over these curves.
      </p>
    );
  if (series.length === 0)
    return <p className="text-sm text-muted">This calculation has no curve to draw a log over.</p>;

  return (
    <div className="flex flex-col gap-4">
      {logs.length > 1 && (
        <div className="field text-sm">
          <label htmlFor={`${uid}-log`}>Test log</label>
          <select
            id={`${uid}-log`}
            className="input py-1"
            value={logIndex}
            onChange={(e) => setLogIndex(Number(e.target.value))}
          >
            {logs.map((l, i) => (
              <option key={l.attachmentId} value={i}>
                {l.fileName} — {l.recordTitle}
              </option>
            ))}
          </select>
        </div>
      )}
      <LogView
        key={log.attachmentId}
        log={log}
        kind={kind}
        title={title}
        subsystem={subsystem}
        inputs={inputs}
        series={series}
        canSave={canSave}
      />
    </div>
  );
}

/** One log: loads it, lets the person pick curves and columns, and draws it (remounted when the log changes). */
function LogView({
  log,
  kind,
  title,
  subsystem,
  inputs,
  series,
  canSave,
}: {
  log: OverlayLog;
  kind: string;
  title: string;
  subsystem: string;
  inputs: Record<string, unknown>;
  series: SeriesSet[];
  canSave: boolean;
}) {
  const uid = useId();
  const [table, setTable] = useState<CsvTable | null>(null);
  const [loadError, setLoadError] = useState('');
  const [setIndex, setSetIndex] = useState(0);
  // null: the default column choice for the current curves
  const [xChoice, setXChoice] = useState<number | null>(null);
  const [yChoice, setYChoice] = useState<number[] | null>(null);

  useEffect(() => {
    let live = true;
    fetch(log.url, { credentials: 'same-origin' })
      .then((r) => (r.ok ? r.text() : Promise.reject(new Error(String(r.status)))))
      .then((text) => live && setTable(parseCsv(text, MAX_ROWS)))
      .catch(() => live && setLoadError(`Could not load ${log.fileName}.`));
    return () => {
      live = false;
    };
  }, [log]);

  const chartSet = series[setIndex];
  const numeric = useMemo(() => (table ? numericColumns(table) : []), [table]);
  const columns = useMemo(() => (table ? table.header.map(logColumn) : []), [table]);
  // Default columns: the x column whose unit converts to the chart's x unit, and every y that converts to a curve's.
  const defaultX = numeric.find((i) => unitConversion(columns[i].unit, chartSet.x.unit)) ?? numeric[0] ?? -1;
  const xCol = xChoice ?? defaultX;
  const yCols =
    yChoice ??
    numeric.filter((i) => i !== xCol && chartSet.y.some((y) => unitConversion(columns[i].unit, y.unit) !== null));
  const toggleY = (i: number) => setYChoice(yCols.includes(i) ? yCols.filter((k) => k !== i) : [...yCols, i]);

  const xConv = xCol >= 0 ? unitConversion(columns[xCol]?.unit ?? '', chartSet.x.unit) : null;
  const values = (i: number) => (table ? table.rows.map((r) => Number(r[i])) : []);
  let datasets: ChartDataset[] | null = null;
  const unmatched: string[] = [];
  if (table && xCol >= 0 && xConv) {
    const order = values(xCol)
      .map((v, i) => ({ v: xConv(v), i }))
      .filter((p) => Number.isFinite(p.v))
      .sort((a, b) => a.v - b.v);
    const matched = yCols.flatMap((c) => {
      const target = chartSet.y.findIndex((y) => unitConversion(columns[c].unit, y.unit) !== null);
      if (target < 0) unmatched.push(columns[c].header);
      return target < 0 ? [] : [{ c, target }];
    });
    // Only the curves a logged column is drawn against, in the same order as the logged columns, so a curve and its
    // log share a colour and differ by dash.
    const targets = [...new Set(matched.map((m) => m.target))].sort((a, b) => a - b);
    const ys = targets.flatMap((t) =>
      matched
        .filter((m) => m.target === t)
        .slice(0, 1)
        .map(({ c }) => {
          const conv = unitConversion(columns[c].unit, chartSet.y[t].unit)!;
          const raw = values(c);
          return {
            name: columns[c].header,
            label: `${readableWords(columns[c].label)} (logged)`,
            unit: chartSet.y[t].unit,
            values: order.map((p) => conv(raw[p.i])),
          };
        }),
    );
    if (ys.length > 0)
      datasets = [
        { name: 'Prediction', set: { ...chartSet, y: targets.map((t) => chartSet.y[t]) } },
        { name: 'Log', set: { title: log.fileName, x: { ...chartSet.x, values: order.map((p) => p.v) }, y: ys } },
      ];
  }

  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-wrap items-end gap-4 text-sm">
        {series.length > 1 && (
          <div className="field">
            <label htmlFor={`${uid}-set`}>Curves</label>
            <select
              id={`${uid}-set`}
              className="input py-1"
              value={setIndex}
              onChange={(e) => {
                setSetIndex(Number(e.target.value));
                setXChoice(null);
                setYChoice(null);
              }}
            >
              {series.map((s, i) => (
                <option key={s.title} value={i}>
                  {plainSymbols(s.title)}
                </option>
              ))}
            </select>
          </div>
        )}
        {table && numeric.length > 0 && (
          <div className="field">
            <label htmlFor={`${uid}-x`}>
              Log column along x (<Sym text={chartSet.x.label} />)
            </label>
            <select
              id={`${uid}-x`}
              className="input py-1"
              value={xCol}
              onChange={(e) => {
                setXChoice(Number(e.target.value));
                setYChoice(null);
              }}
            >
              {numeric.map((i) => (
                <option key={i} value={i} title={table.header[i]}>
                  {columnLabel(table.header[i])}
                </option>
              ))}
            </select>
          </div>
        )}
        {table && numeric.length > 1 && (
          <fieldset className="flex flex-wrap gap-3">
            <legend className="mb-1 font-semibold">Logged columns to draw</legend>
            {numeric
              .filter((i) => i !== xCol)
              .map((i) => (
                <label key={i} className="flex items-center gap-1" title={table.header[i]}>
                  <input type="checkbox" checked={yCols.includes(i)} onChange={() => toggleY(i)} />
                  {columnLabel(table.header[i])}
                </label>
              ))}
          </fieldset>
        )}
      </div>
      <p className="text-sm text-muted">
        From <a href={log.recordUrl}>{log.recordTitle}</a>: <a href={log.url}>{log.fileName}</a>
        {table ? `, ${table.rows.length} rows${table.truncated ? ' (first 20,000 used)' : ''}` : ''}. Units come from
        the column names’ suffixes (<code>_mps</code>, <code>_kn</code>, <code>_W</code>, <code>_kW</code>,{' '}
        <code>_N</code>, <code>_C</code>…).
      </p>
      <div aria-live="polite">
        {loadError && <p className="alert">{loadError}</p>}
        {!table && !loadError && <p className="text-sm text-muted">Loading {log.fileName}…</p>}
        {table && numeric.length === 0 && <p className="text-sm text-muted">This log has no numeric columns.</p>}
        {table && xCol >= 0 && !xConv && (
          <p className="notice text-sm">
            The column <code>{table.header[xCol]}</code> has no unit that converts to{' '}
            {chartSet.x.unit || 'the curve’s x'}; name it with a suffix such as <code>_mps</code> or choose another
            column.
          </p>
        )}
        {unmatched.length > 0 && (
          <p className="text-sm text-muted">Not drawn (no matching curve unit): {unmatched.join(', ')}.</p>
        )}
      </div>
      {datasets && <LineChart datasets={datasets} height={300} title={`${log.fileName} over ${chartSet.title}`} />}
      {datasets && kind === 'resistance' && (
        <p className="text-sm text-muted">
          A logged battery power includes the drivetrain’s losses; the curve is effective power. The fit below divides
          by the drivetrain efficiency.
        </p>
      )}
      {kind === 'resistance' && table && (
        <FormFactorFit
          key={log.attachmentId}
          table={table}
          numeric={numeric}
          inputs={inputs}
          title={title}
          subsystem={subsystem}
          log={log}
          canSave={canSave}
        />
      )}
    </div>
  );
}

function FormFactorFit({
  table,
  numeric,
  inputs,
  title,
  subsystem,
  log,
  canSave,
}: {
  table: CsvTable;
  numeric: number[];
  inputs: Record<string, unknown>;
  title: string;
  subsystem: string;
  log: OverlayLog;
  canSave: boolean;
}) {
  const uid = useId();
  const columns = table.header.map(logColumn);
  const speedCols = numeric.filter((i) => unitConversion(columns[i].unit, 'm/s'));
  const powerCols = numeric.filter((i) => unitConversion(columns[i].unit, 'W'));
  const [speedCol, setSpeedCol] = useState(speedCols[0] ?? -1);
  const [powerCol, setPowerCol] = useState(powerCols[0] ?? -1);
  const [eta, setEta] = useState('0.6');
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState('');
  const [fieldErrors, setFieldErrors] = useState<Record<string, string>>({});
  const [fit, setFit] = useState<FitResult | null>(null);
  const [saved, setSaved] = useState<{ url: string; linked: boolean; note: string } | null>(null);

  if (speedCols.length === 0 || powerCols.length === 0)
    return (
      <p className="text-sm text-muted">
        To fit the form factor the log needs a speed column (<code>_mps</code>, <code>_kn</code> or <code>_kmh</code>)
        and an electrical power column (<code>_W</code> or <code>_kW</code>).
      </p>
    );

  async function runFit() {
    setBusy(true);
    setError('');
    setFieldErrors({});
    setSaved(null);
    const vc = unitConversion(columns[speedCol].unit, 'm/s')!;
    const pc = unitConversion(columns[powerCol].unit, 'W')!;
    const points = table.rows
      .map((r) => ({ speed_mps: vc(Number(r[speedCol])), power_W: pc(Number(r[powerCol])) }))
      .filter((p) => Number.isFinite(p.speed_mps) && Number.isFinite(p.power_W) && p.speed_mps > 0);
    try {
      const res = await apiFetch<FitResult>('/api/calculators/resistance/fit', {
        method: 'POST',
        json: { inputs, points, drivetrainEfficiency: Number(eta) },
      });
      setFit(res);
    } catch (e) {
      if (e instanceof ApiError) {
        setError(e.message);
        setFieldErrors(e.fieldErrors());
      } else setError('Could not reach the server; try again.');
      setFit(null);
    } finally {
      setBusy(false);
    }
  }

  async function save() {
    if (!fit?.inputs) return;
    setBusy(true);
    setError('');
    try {
      const note = `Form factor fitted to the test log ${log.fileName} of “${log.recordTitle}”: (1+k) = ${formatNumber(fit.formFactor, 4)}, R² = ${fit.rSquared === null ? '–' : formatNumber(fit.rSquared, 3)}, drivetrain efficiency ${eta}, ${fit.residuals.length} points.`;
      const { calculation } = await apiFetch<{ calculation: { id: string; url: string } }>('/api/calculations', {
        method: 'POST',
        json: {
          kind: 'resistance',
          title: `${title} — fitted to ${log.fileName}`.slice(0, 160),
          subsystem,
          inputs: fit.inputs,
          notes: note,
        },
      });
      let linked = false;
      let linkNote = '';
      if (log.canLink) {
        try {
          await apiFetch(`/api/records/${log.recordId}`, {
            method: 'PATCH',
            json: { version: log.recordVersion, calculationIds: [...log.recordCalculationIds, calculation.id] },
          });
          linked = true;
        } catch (e) {
          linkNote =
            e instanceof ApiError && e.status === 409
              ? 'The record changed since this page was loaded, so the new calculation is not linked yet: link it from the record.'
              : 'The new calculation could not be linked to the record: link it from the record.';
        }
      } else linkNote = 'You cannot edit that record, so ask its author or a lead to link the new calculation.';
      setSaved({ url: calculation.url, linked, note: linkNote });
    } catch (e) {
      setError(e instanceof ApiError ? e.message : 'Could not reach the server; try again.');
    } finally {
      setBusy(false);
    }
  }

  const fitted: ChartDataset[] | null = fit
    ? (() => {
        const pts = [...fit.residuals].sort((a, b) => a.speed_mps - b.speed_mps);
        return [
          {
            name: 'Fit',
            set: {
              title: 'Logged and fitted electrical power',
              x: { name: 'speed_mps', label: 'Speed', unit: 'm/s', values: pts.map((p) => p.speed_mps) },
              y: [
                { name: 'power_W', label: 'Logged power', unit: 'W', values: pts.map((p) => p.power_W) },
                { name: 'predicted_W', label: 'Fitted model', unit: 'W', values: pts.map((p) => p.predicted_W) },
              ],
            },
          },
        ];
      })()
    : null;

  return (
    <section aria-labelledby={`${uid}-h`} className="card flex flex-col gap-3">
      <h3 id={`${uid}-h`} className="font-semibold">
        Fit the form factor to this log
      </h3>
      <p className="text-sm text-muted">
        Finds the form factor (1+k) that makes the predicted electrical power, (1+k)·R_F·V plus appendage drag, divided
        by the drivetrain efficiency, best match the logged power (least squares). Use calm-water runs at steady speed.
      </p>
      <div className="flex flex-wrap items-end gap-4 text-sm">
        <div className="field">
          <label htmlFor={`${uid}-v`}>Speed column</label>
          <select
            id={`${uid}-v`}
            className="input py-1"
            value={speedCol}
            onChange={(e) => setSpeedCol(Number(e.target.value))}
          >
            {speedCols.map((i) => (
              <option key={i} value={i} title={table.header[i]}>
                {columnLabel(table.header[i])}
              </option>
            ))}
          </select>
        </div>
        <div className="field">
          <label htmlFor={`${uid}-p`}>Electrical power column</label>
          <select
            id={`${uid}-p`}
            className="input py-1"
            value={powerCol}
            onChange={(e) => setPowerCol(Number(e.target.value))}
          >
            {powerCols.map((i) => (
              <option key={i} value={i} title={table.header[i]}>
                {columnLabel(table.header[i])}
              </option>
            ))}
          </select>
        </div>
        <div className="field">
          <label htmlFor={`${uid}-eta`}>Drivetrain efficiency (battery to thrust)</label>
          <input
            id={`${uid}-eta`}
            className="input w-28 py-1"
            type="number"
            inputMode="decimal"
            min={0.05}
            max={1}
            step={0.01}
            value={eta}
            aria-invalid={fieldErrors.drivetrainEfficiency ? true : undefined}
            aria-describedby={fieldErrors.drivetrainEfficiency ? `${uid}-eta-err` : undefined}
            onChange={(e) => setEta(e.target.value)}
          />
          {fieldErrors.drivetrainEfficiency && (
            <p id={`${uid}-eta-err`} className="field-error">
              {fieldErrors.drivetrainEfficiency}
            </p>
          )}
        </div>
        <button type="button" className="btn btn-primary" onClick={runFit} disabled={busy}>
          {busy && !fit ? 'Fitting…' : 'Fit form factor'}
        </button>
      </div>
      <div aria-live="polite" className="flex flex-col gap-2">
        {error && <p className="alert">{error}</p>}
        {fit && (
          <>
            <p>
              Fitted form factor <strong className="tabular">{formatNumber(fit.formFactor, 4)}</strong> (this
              calculation uses {typeof inputs.formFactor === 'number' ? inputs.formFactor : 1}), R²{' '}
              <strong className="tabular">{fit.rSquared === null ? '–' : formatNumber(fit.rSquared, 3)}</strong> over{' '}
              {fit.residuals.length} points.
            </p>
            {fit.warnings.map((w) => (
              <p key={w} className="notice text-sm">
                {w}
              </p>
            ))}
          </>
        )}
      </div>
      {fitted && <LineChart datasets={fitted} height={260} />}
      {fit && fit.inputs && canSave && !saved && (
        <div>
          <button type="button" className="btn btn-quiet" onClick={save} disabled={busy}>
            Save the fitted run as a new calculation linked to “{log.recordTitle}”
          </button>
        </div>
      )}
      {saved && (
        <p className="text-sm" role="status">
          Saved: <a href={saved.url}>the fitted calculation</a>
          {saved.linked ? `, linked to “${log.recordTitle}”.` : '. '}
          {saved.note}
        </p>
      )}
    </section>
  );
}
