import { useDeferredValue, useMemo, useState, type FormEvent } from 'react';
import { getCalculator, runCalculator } from '~/lib/calc';
import { activeInputs } from '~/lib/calc/fields';
import type { InputMeta } from '~/lib/calc/types';
import { titlePlaceholderFor } from '~/lib/calc-defaults';
import { operatingPoints } from '~/lib/chart-marks';
import { apiFetch, ApiError } from '~/lib/client/api';
import { formatQuantity, plainText } from '~/lib/format';
import LineChart from '../ui/LineChart';
import Sym from '../ui/Sym';
import SubsystemSelect from '../ui/SubsystemSelect';
import { plainSymbols } from '~/lib/symbols';
import GridTable from './GridTable';

interface Props {
  kind: string;
  initialInputs?: Record<string, unknown>;
  subsystems?: { slug: string; name: string }[];
  defaultSubsystem?: string;
  canSave?: boolean;
  /** Embedded in a guide: no save form, compact layout. */
  embedded?: boolean;
}

type Raw = Record<string, string>;

function initialRaw(inputs: InputMeta[], given: Record<string, unknown> = {}): Raw {
  const raw: Raw = {};
  for (const m of inputs) {
    const v = given[m.name] ?? (m.optional ? undefined : m.default);
    raw[m.name] = plainText(v);
  }
  return raw;
}

/**
 * Form text → the JSON the calculator's schema expects, for the inputs the chosen options show (a hidden input
 * never feeds the result). Bad numbers stay strings so the schema names them.
 */
function toInputs(inputs: InputMeta[], raw: Raw): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  for (const m of activeInputs(inputs, raw)) {
    const text = (raw[m.name] ?? '').trim();
    if (text === '') {
      if (m.optional) out[m.name] = null;
      continue;
    }
    if (m.kind === 'choice') out[m.name] = text;
    else {
      const n = Number(text.replace(',', '.'));
      out[m.name] = Number.isFinite(n) ? n : text;
    }
  }
  return out;
}

export default function CalculatorForm({
  kind,
  initialInputs,
  subsystems = [],
  defaultSubsystem,
  canSave = false,
  embedded = false,
}: Props) {
  const calc = getCalculator(kind);
  const [raw, setRaw] = useState<Raw>(() => initialRaw(calc?.inputs ?? [], initialInputs));
  const deferred = useDeferredValue(raw);
  const run = useMemo(
    () => (calc ? runCalculator(kind, toInputs(calc.inputs, deferred)) : null),
    [calc, kind, deferred],
  );
  const charts = useMemo(
    () =>
      run?.ok && run.result.series
        ? Object.values(run.result.series).map((set) => ({
            datasets: [{ set }],
            marks: operatingPoints(set, run.result.outputs, run.inputs),
          }))
        : [],
    [run],
  );
  const shown = useMemo(() => new Set(activeInputs(calc?.inputs ?? [], raw).map((m) => m.name)), [calc, raw]);

  if (!calc || !run) return <p className="alert">Unknown calculator “{kind}”.</p>;

  const fieldErrors: Record<string, string> = {};
  if (!run.ok && run.error === 'invalid_input')
    for (const i of run.issues) fieldErrors[i.path.split('.')[0]] ??= i.message;
  if (!run.ok && run.error === 'out_of_range') fieldErrors[run.input] ??= run.message;

  const visible = calc.inputs.filter((m) => shown.has(m.name));
  const groups = [...new Set(visible.map((m) => m.group ?? 'Inputs'))];
  const set = (name: string, value: string) => setRaw((r) => ({ ...r, [name]: value }));

  return (
    <div
      className={
        embedded
          ? 'calc-embed card my-6 flex flex-col gap-6'
          : 'grid items-start gap-8 lg:grid-cols-[minmax(0,26rem)_minmax(0,1fr)]'
      }
      data-calculator={kind}
    >
      <form
        className="flex flex-col gap-5"
        onSubmit={(e) => e.preventDefault()}
        aria-label={`${calc.title} inputs`}
        noValidate
      >
        {embedded && <p className="eyebrow">Live calculator · {calc.title}</p>}
        {groups.map((g) => (
          <fieldset key={g} className="flex flex-col gap-3">
            <legend className="mb-1 text-sm font-bold uppercase tracking-wide text-muted">{g}</legend>
            {visible
              .filter((m) => (m.group ?? 'Inputs') === g)
              .map((m) => (
                <Field
                  key={m.name}
                  meta={m}
                  value={raw[m.name] ?? ''}
                  error={fieldErrors[m.name]}
                  onChange={(v) => set(m.name, v)}
                  idPrefix={embedded ? `emb-${kind}` : 'in'}
                />
              ))}
          </fieldset>
        ))}
        <button
          type="button"
          className="btn btn-quiet self-start"
          onClick={() => setRaw(initialRaw(calc.inputs, initialInputs))}
        >
          {initialInputs ? 'Reset to the starting values' : 'Reset to defaults'}
        </button>
      </form>

      {/* On a wide screen the results stay in view while the form scrolls past (long forms: race, sweep); charts,
          the heat map and the save form follow below, across both columns. */}
      <section
        aria-labelledby={`results-${kind}`}
        aria-live="polite"
        data-testid="results"
        className={
          embedded
            ? 'flex min-w-0 flex-col gap-4'
            : 'sticky-results flex min-w-0 flex-col gap-4 lg:sticky lg:top-4 lg:max-h-[calc(100vh-2rem)] lg:self-start lg:overflow-y-auto lg:pr-1'
        }
      >
        <h2 id={`results-${kind}`} className="text-lg font-semibold">
          Results
        </h2>
        {!run.ok && (
          <p className="alert" role="status">
            {run.error === 'out_of_range' ? run.message : 'Some inputs need attention: see the messages beside them.'}
          </p>
        )}
        {run.ok && (
          <>
            <table className="tabular w-full border-collapse text-sm" data-testid="outputs">
              <caption className="sr-only">Computed outputs</caption>
              <tbody>
                {calc.outputs.map((o) => {
                  const q = formatQuantity(run.result.outputs[o.name], o.unit, o.digits);
                  return (
                    <tr key={o.name} className="border-b border-line">
                      <th
                        scope="row"
                        className="py-1.5 pr-3 text-left font-medium"
                        title={o.help && plainSymbols(o.help)}
                      >
                        <Sym text={o.label} />
                      </th>
                      <td className="py-1.5 text-right font-semibold" data-output={o.name}>
                        {q.value}
                      </td>
                      <td className="w-20 py-1.5 pl-2 text-muted">{q.unit}</td>
                    </tr>
                  );
                })}
              </tbody>
            </table>
            {run.result.warnings.length > 0 && (
              <ul className="notice flex flex-col gap-1 text-sm" aria-label="Warnings">
                {run.result.warnings.map((w) => (
                  <li key={w}>
                    <span aria-hidden="true">⚠ </span>
                    <Sym text={w} />
                  </li>
                ))}
              </ul>
            )}
          </>
        )}
      </section>
      {run.ok && (charts.length > 0 || run.result.grid || run.result.grids?.length) && (
        <div className={embedded ? 'flex min-w-0 flex-col gap-4' : 'flex min-w-0 flex-col gap-6 lg:col-span-2'}>
          {(embedded ? charts.slice(0, 1) : charts).map((c, i) => (
            <LineChart key={i} datasets={c.datasets} marks={c.marks} height={embedded ? 280 : 320} />
          ))}
          {run.result.grid && <GridTable grid={run.result.grid} />}
          {run.result.grids?.map((g) => (
            <GridTable key={g.title} grid={g} />
          ))}
        </div>
      )}
      {!embedded && canSave && run.ok && (
        <div className="lg:col-span-2">
          <SaveForm
            kind={kind}
            placeholder={titlePlaceholderFor(kind, calc.title)}
            inputs={run.inputs}
            subsystems={subsystems}
            defaultSubsystem={defaultSubsystem}
          />
        </div>
      )}
    </div>
  );
}

function Field({
  meta,
  value,
  error,
  onChange,
  idPrefix,
}: {
  meta: InputMeta;
  value: string;
  error?: string;
  onChange: (v: string) => void;
  idPrefix: string;
}) {
  const id = `${idPrefix}-${meta.name}`;
  const describedBy = [`${id}-help`, error ? `${id}-error` : ''].filter(Boolean).join(' ');
  return (
    <div className="field">
      <label htmlFor={id}>
        <Sym text={meta.label} />
        {meta.optional && <span className="font-normal text-muted"> (optional)</span>}
      </label>
      <div className="flex items-center gap-2">
        {meta.kind === 'choice' ? (
          <select
            id={id}
            className="input"
            value={value}
            onChange={(e) => onChange(e.target.value)}
            aria-describedby={describedBy}
            aria-invalid={error ? true : undefined}
          >
            {(meta.options ?? []).map((o) => (
              <option key={o.value} value={o.value}>
                {plainSymbols(o.label)}
              </option>
            ))}
          </select>
        ) : (
          <input
            id={id}
            className="input tabular"
            inputMode="decimal"
            value={value}
            onChange={(e) => onChange(e.target.value)}
            aria-describedby={describedBy}
            aria-invalid={error ? true : undefined}
            autoComplete="off"
          />
        )}
        {meta.unit && (
          <span className="w-16 shrink-0 text-sm text-muted" aria-hidden="true">
            {meta.unit}
          </span>
        )}
      </div>
      <p id={`${id}-help`} className="text-xs text-muted">
        <Sym text={meta.help} />
        {meta.unit && <span className="sr-only"> Unit: {meta.unit}.</span>}
        {meta.min !== undefined && meta.max !== undefined && (
          <>
            {' '}
            Range {meta.min}–{meta.max}
            {meta.unit ? ` ${meta.unit}` : ''}.
          </>
        )}
      </p>
      {error && (
        <p id={`${id}-error`} className="field-error">
          {error}
        </p>
      )}
    </div>
  );
}

function SaveForm({
  kind,
  placeholder,
  inputs,
  subsystems,
  defaultSubsystem,
}: {
  kind: string;
  placeholder: string;
  inputs: Record<string, unknown>;
  subsystems: { slug: string; name: string }[];
  defaultSubsystem?: string;
}) {
  const [title, setTitle] = useState('');
  const [subsystem, setSubsystem] = useState(defaultSubsystem ?? subsystems[0]?.slug ?? '');
  const [notes, setNotes] = useState('');
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [message, setMessage] = useState('');
  const [saving, setSaving] = useState(false);

  async function save(e: FormEvent) {
    e.preventDefault();
    setSaving(true);
    setErrors({});
    setMessage('');
    try {
      const res = await apiFetch<{ calculation: { url: string } }>('/api/calculations', {
        method: 'POST',
        json: { kind, title, subsystem, notes, inputs },
      });
      window.location.assign(res.calculation.url);
    } catch (err) {
      setSaving(false);
      if (err instanceof ApiError) {
        setErrors(err.fieldErrors());
        setMessage(err.status === 401 ? 'Your session ended: sign in again in another tab, then save.' : err.message);
      } else setMessage('Could not reach the server. Your inputs are still here; try again.');
    }
  }

  return (
    <form onSubmit={save} className="card mt-2 flex max-w-2xl flex-col gap-3" aria-labelledby="save-h" noValidate>
      <h2 id="save-h" className="text-lg font-semibold">
        Save this calculation
      </h2>
      {message && (
        <p className="alert" role="alert">
          {message}
        </p>
      )}
      <div className="field">
        <label htmlFor="save-title">Title</label>
        <input
          id="save-title"
          className="input"
          value={title}
          onChange={(e) => setTitle(e.target.value)}
          placeholder={placeholder}
          aria-invalid={errors.title ? true : undefined}
          aria-describedby={errors.title ? 'save-title-error' : undefined}
        />
        {errors.title && (
          <p id="save-title-error" className="field-error">
            {errors.title}
          </p>
        )}
      </div>
      <SubsystemSelect
        id="save-subsystem"
        value={subsystem}
        onChange={setSubsystem}
        subsystems={subsystems}
        error={errors.subsystem}
      />
      <div className="field">
        <label htmlFor="save-notes">
          Notes <span className="font-normal text-muted">(optional: why these inputs, where they came from)</span>
        </label>
        <textarea id="save-notes" className="input min-h-24" value={notes} onChange={(e) => setNotes(e.target.value)} />
      </div>
      <button type="submit" className="btn btn-primary self-start" disabled={saving}>
        {saving ? 'Saving…' : 'Save calculation'}
      </button>
    </form>
  );
}
