import { useId, useMemo, useState } from 'react';

export interface PickOption {
  id: string;
  title: string;
  detail: string;
}

/** A filterable checklist for linking saved calculations or other records. */
export default function LinkPicker({
  label,
  options,
  selected,
  onChange,
  loading,
  emptyText,
}: {
  label: string;
  options: PickOption[];
  selected: string[];
  onChange: (ids: string[]) => void;
  loading?: boolean;
  emptyText: string;
}) {
  const id = useId();
  const [filter, setFilter] = useState('');
  const shown = useMemo(() => {
    const f = filter.trim().toLowerCase();
    const list = f ? options.filter((o) => `${o.title} ${o.detail}`.toLowerCase().includes(f)) : options;
    // Selected first, so what is linked is always visible.
    return [...list].sort((a, b) => Number(selected.includes(b.id)) - Number(selected.includes(a.id)));
  }, [options, filter, selected]);
  const toggle = (x: string) => onChange(selected.includes(x) ? selected.filter((s) => s !== x) : [...selected, x]);
  return (
    <fieldset className="flex flex-col gap-2">
      <legend className="text-sm font-semibold">
        {label} <span className="font-normal text-muted">({selected.length} linked)</span>
      </legend>
      <label htmlFor={`${id}-filter`} className="sr-only">
        Filter {label.toLowerCase()}
      </label>
      <input
        id={`${id}-filter`}
        className="input py-1 text-sm"
        placeholder="Filter by title…"
        value={filter}
        onChange={(e) => setFilter(e.target.value)}
      />
      <div className="max-h-48 overflow-y-auto rounded border border-line p-1">
        {loading && <p className="p-2 text-sm text-muted">Loading…</p>}
        {!loading && shown.length === 0 && <p className="p-2 text-sm text-muted">{emptyText}</p>}
        {shown.slice(0, 200).map((o) => (
          <label key={o.id} className="flex cursor-pointer items-start gap-2 rounded p-1.5 text-sm hover:bg-sunken">
            <input type="checkbox" className="mt-1" checked={selected.includes(o.id)} onChange={() => toggle(o.id)} />
            <span>
              <span className="font-medium">{o.title}</span> <span className="text-muted">· {o.detail}</span>
            </span>
          </label>
        ))}
      </div>
    </fieldset>
  );
}
