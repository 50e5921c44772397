import { useEffect, useRef } from 'react';
import uPlot from 'uplot';
import 'uplot/dist/uPlot.min.css';
import type { SeriesSet } from '~/lib/calc/types';
import { formatNumber } from '~/lib/format';

export interface ChartDataset {
  /** Prefixed to each line's label when several datasets are overlaid (e.g. "A", "B"). */
  name?: string;
  set: SeriesSet;
}

const COLOURS = ['#115e56', '#b5730a', '#7d4a6c', '#3c5a99', '#2c7a48', '#a3261b'];
const DASHES: (number[] | undefined)[] = [undefined, [8, 4], [2, 3], [12, 3, 2, 3]];

/** Line chart of one or more series sets on a shared numeric x axis; units pick the left or right y axis. */
export default function LineChart({
  datasets,
  height = 300,
  title,
}: {
  datasets: ChartDataset[];
  height?: number;
  title?: string;
}) {
  const el = useRef<HTMLDivElement>(null);

  useEffect(() => {
    const host = el.current;
    if (!host || datasets.length === 0) return;
    const first = datasets[0].set;
    const units = [...new Set(datasets.flatMap((d) => d.set.y.map((y) => y.unit)))];
    const tables = datasets.map((d) => [d.set.x.values, ...d.set.y.map((y) => y.values)] as uPlot.AlignedData);
    const data = datasets.length === 1 ? tables[0] : uPlot.join(tables);
    const lines: uPlot.Series[] = [];
    datasets.forEach((d, di) =>
      d.set.y.forEach((y, yi) => {
        const scale = units.indexOf(y.unit) === 0 ? 'left' : 'right';
        lines.push({
          label: `${d.name ? `${d.name}: ` : ''}${y.label}${y.unit ? ` (${y.unit})` : ''}`,
          stroke: COLOURS[yi % COLOURS.length], // one colour per quantity, so A and B of the same curve match
          // Overlaid datasets differ by dash; lines within one dataset by colour and by dash too, never colour alone.
          dash: datasets.length > 1 ? DASHES[di % DASHES.length] : DASHES[yi % DASHES.length],
          width: 2,
          scale,
          spanGaps: true,
          value: (_u, v) => (v == null ? '–' : formatNumber(v, 3)),
        });
      }),
    );
    const axisStyle = {
      stroke: 'currentColor',
      grid: { stroke: 'rgba(127,127,127,0.2)' },
      ticks: { stroke: 'rgba(127,127,127,0.3)' },
    };
    const opts: uPlot.Options = {
      width: host.clientWidth || 600,
      height,
      scales: { x: { time: false }, left: {}, right: {} },
      series: [
        {
          label: `${first.x.label}${first.x.unit ? ` (${first.x.unit})` : ''}`,
          value: (_u, v) => (v == null ? '–' : formatNumber(v, 3)),
        },
        ...lines,
      ],
      axes: [
        { ...axisStyle, label: `${first.x.label}${first.x.unit ? ` (${first.x.unit})` : ''}` },
        { ...axisStyle, scale: 'left', label: units[0] || '' },
        ...(units.length > 1
          ? [
              {
                ...axisStyle,
                scale: 'right',
                side: 1 as const,
                label: units.slice(1).join(', '),
                grid: { show: false },
              },
            ]
          : []),
      ],
      legend: { live: true },
    };
    const chart = new uPlot(opts, data, host);
    const resize = new ResizeObserver(() => chart.setSize({ width: host.clientWidth, height }));
    resize.observe(host);
    return () => {
      resize.disconnect();
      chart.destroy();
    };
  }, [datasets, height]);

  const first = datasets[0]?.set;
  const label = title ?? first?.title ?? 'Chart';
  return (
    <figure className="text-ink">
      <div
        ref={el}
        role="img"
        aria-label={`${label}: ${datasets.flatMap((d) => d.set.y.map((y) => y.label)).join(', ')} against ${first?.x.label ?? 'x'}`}
      />
      <figcaption className="mt-1 text-sm text-muted">{label}</figcaption>
      {first && <DataTable datasets={datasets} />}
    </figure>
  );
}

/** The chart's numbers as a table, for screen readers and for copying. */
function DataTable({ datasets }: { datasets: ChartDataset[] }) {
  return (
    <details className="mt-2 text-sm">
      <summary className="cursor-pointer text-muted">Show the data as a table</summary>
      {datasets.map((d, i) => {
        const n = d.set.x.values.length;
        const step = Math.max(1, Math.ceil(n / 40));
        const rows = d.set.x.values.map((_, j) => j).filter((j) => j % step === 0 || j === n - 1);
        return (
          <div key={i} className="mt-2 max-h-72 overflow-auto">
            <table className="tabular border-collapse text-xs">
              <caption className="text-left font-semibold">
                {d.name ? `${d.name}: ` : ''}
                {d.set.title}
              </caption>
              <thead>
                <tr>
                  {[d.set.x, ...d.set.y].map((a) => (
                    <th key={a.name} scope="col" className="border border-line px-2 py-1 text-left">
                      {a.label}
                      {a.unit ? ` (${a.unit})` : ''}
                    </th>
                  ))}
                </tr>
              </thead>
              <tbody>
                {rows.map((j) => (
                  <tr key={j}>
                    {[d.set.x, ...d.set.y].map((a) => (
                      <td key={a.name} className="border border-line px-2 py-0.5 text-right">
                        {formatNumber(a.values[j], 3)}
                      </td>
                    ))}
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        );
      })}
    </details>
  );
}
