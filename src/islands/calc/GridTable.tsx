import type { Grid } from '~/lib/calc/types';
import { formatNumber } from '~/lib/format';

/** A heat map as a table: each cell is coloured by value and also prints its number (never colour alone). */
export default function GridTable({ grid, highlight }: { grid: Grid; highlight?: { x: number; y: number }[] }) {
  const values = grid.z.values.flat().filter((v): v is number => typeof v === 'number' && Number.isFinite(v));
  const lo = Math.min(...values);
  const hi = Math.max(...values);
  const shade = (v: number | null) => {
    if (v === null || !Number.isFinite(v) || hi === lo) return undefined;
    const t = (v - lo) / (hi - lo);
    return `color-mix(in oklab, var(--wb-accent) ${Math.round(10 + t * 70)}%, var(--wb-surface))`;
  };
  const isHighlighted = (xi: number, yi: number) =>
    highlight?.some((h) => h.x === grid.x.values[xi] && h.y === grid.y.values[yi]);
  return (
    <div className="overflow-x-auto">
      <table className="tabular border-collapse text-xs">
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
              {row.map((v, xi) => (
                <td
                  key={xi}
                  className="border border-line px-1.5 py-1 text-right"
                  style={{
                    background: shade(v),
                    outline: isHighlighted(xi, yi) ? '2px solid var(--wb-amber)' : undefined,
                  }}
                >
                  {v === null ? '' : formatNumber(v, 2)}
                  {isHighlighted(xi, yi) && <span className="sr-only"> (best)</span>}
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
