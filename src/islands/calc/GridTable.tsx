import type { Grid } from '~/lib/calc/types';
import { formatNumber } from '~/lib/format';

/** Six fill steps; each step's text colour is set with its fill in global.css (.heat-0 … .heat-5), per theme. */
const STEPS = 6;

const near = (a: number, b: number) => Math.abs(a - b) <= 1e-9 * Math.max(1, Math.abs(a), Math.abs(b));

/**
 * A heat map as a table: each cell is shaded by value and also prints its number (never colour alone); the
 * grid's marked cells (e.g. the best of each objective) carry a symbol, an outline and a line in the key.
 */
export default function GridTable({ grid }: { grid: Grid }) {
  const values = grid.z.values.flat().filter((v): v is number => typeof v === 'number' && Number.isFinite(v));
  const lo = Math.min(...values);
  const hi = Math.max(...values);
  const step = (v: number | null) => {
    if (v === null || !Number.isFinite(v)) return undefined;
    if (hi === lo) return 'heat-3';
    return `heat-${Math.min(STEPS - 1, Math.floor(((v - lo) / (hi - lo)) * STEPS))}`;
  };
  const marks = grid.marks ?? [];
  const marksAt = (xi: number, yi: number) =>
    marks.filter((m) => near(m.x, grid.x.values[xi]) && near(m.y, grid.y.values[yi]));
  return (
    <div className="flex min-w-0 flex-col gap-2">
      <div className="overflow-x-auto">
        <table className="heat-map tabular border-collapse text-xs">
          <caption className="mb-1 text-left text-sm font-semibold">
            {grid.title} — {grid.z.label}
            {grid.z.unit ? ` (${grid.z.unit})` : ''}; rows: {grid.y.label}, columns: {grid.x.label}. Empty cells: no
            operating point.
          </caption>
          <thead>
            <tr>
              <th scope="col" className="border border-line px-1.5 py-1">
                {grid.y.label} \ {grid.x.label}
              </th>
              {grid.x.values.map((x) => (
                <th key={x} scope="col" className="border border-line px-1.5 py-1">
                  {formatNumber(x, 2)}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {grid.z.values.map((row, yi) => (
              <tr key={yi}>
                <th scope="row" className="border border-line px-1.5 py-1">
                  {formatNumber(grid.y.values[yi], 2)}
                </th>
                {row.map((v, xi) => {
                  const here = marksAt(xi, yi);
                  return (
                    <td
                      key={xi}
                      className={`border border-line px-1.5 py-1 text-right ${step(v) ?? ''} ${here.length ? 'heat-mark' : ''}`}
                      data-mark={here.map((m) => m.symbol).join('') || undefined}
                    >
                      {here.length > 0 && (
                        <strong className="mr-1" aria-hidden="true">
                          {here.map((m) => m.symbol).join('+')}
                        </strong>
                      )}
                      {v === null ? '' : formatNumber(v, 2)}
                      {here.length > 0 && <span className="sr-only"> ({here.map((m) => m.label).join('; ')})</span>}
                    </td>
                  );
                })}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {marks.length > 0 && (
        <ul className="flex flex-col gap-0.5 text-sm" aria-label="Marked cells">
          {marks.map((m) => (
            <li key={m.symbol}>
              <strong className="heat-key">{m.symbol}</strong> {m.label}: {grid.y.label} {formatNumber(m.y, 2)},{' '}
              {grid.x.label} {formatNumber(m.x, 2)}
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
