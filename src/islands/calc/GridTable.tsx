import type { Grid } from '~/lib/calc/types';
import { formatNumber } from '~/lib/format';
import Sym from '../ui/Sym';

/**
 * A heat map as a table: each cell is coloured by value and also prints its number (never colour alone). Cells that
 * fail a check are greyed out and struck through; picks are outlined and named in text.
 */
export default function GridTable({ grid, highlight }: { grid: Grid; highlight?: { x: number; y: number }[] }) {
  const values = grid.z.values.flat().filter((v): v is number => typeof v === 'number' && Number.isFinite(v));
  const lo = Math.min(...values);
  const hi = Math.max(...values);
  // Six fill steps; each step's text colour is set with its fill in global.css (.heat-0 … .heat-5), per theme.
  const step = (v: number | null) => {
    if (v === null || !Number.isFinite(v)) return '';
    if (hi === lo) return ' heat-3';
    return ` heat-${Math.min(5, Math.floor(((v - lo) / (hi - lo)) * 6))}`;
  };
  const marks = [...(highlight ?? []).map((h) => ({ ...h, label: 'best' })), ...(grid.picks ?? [])];
  const pickAt = (xi: number, yi: number) =>
    marks.find((h) => h.x === grid.x.values[xi] && h.y === grid.y.values[yi])?.label;
  const isFailed = (xi: number, yi: number) => grid.failed?.[yi]?.[xi] === true;
  const anyFailed = grid.failed?.some((row) => row.some(Boolean)) ?? false;
  return (
    <div className="relative overflow-x-auto">
      <table className="heat-map tabular border-collapse text-xs">
        <caption className="mb-1 text-left text-sm font-semibold">
          <Sym text={grid.title} /> — <Sym text={grid.z.label} />
          {grid.z.unit ? ` (${grid.z.unit})` : ''}; rows: <Sym text={grid.y.label} />, columns:{' '}
          <Sym text={grid.x.label} />. Empty cells: no operating point.
          {anyFailed && (
            <>
              {' '}
              Greyed, struck-through cells: <Sym text={grid.failedLabel ?? 'fail a check'} />.
            </>
          )}
          {marks.length > 0 && ` Outlined: ${marks.map((m) => m.label).join(', ')}.`}
        </caption>
        <thead>
          <tr>
            <th scope="col" className="border border-line px-1.5 py-1">
              <Sym text={grid.y.label} /> \ <Sym text={grid.x.label} />
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
                const failed = isFailed(xi, yi);
                const pick = pickAt(xi, yi);
                return (
                  <td
                    key={xi}
                    className={`border border-line px-1.5 py-1 text-right${failed ? ' line-through' : step(v)}${pick ? ' heat-mark' : ''}`}
                    style={failed ? { background: 'var(--wb-line)' } : undefined}
                    data-failed={failed || undefined}
                    data-pick={pick}
                  >
                    {v === null ? '' : formatNumber(v, 2)}
                    {failed && <span className="sr-only"> ({grid.failedLabel ?? 'fails a check'})</span>}
                    {pick && <span className="sr-only"> ({pick})</span>}
                  </td>
                );
              })}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
