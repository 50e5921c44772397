import { useEffect, useRef, useState } from 'react';
import uPlot from 'uplot';
import 'uplot/dist/uPlot.min.css';
import type { SeriesSet } from '~/lib/calc/types';
import { restingIndex, valueAt, type ChartMark } from '~/lib/chart-marks';
import { formatNumber } from '~/lib/format';
import { plainSymbols } from '~/lib/symbols';
import Sym from './Sym';

export interface ChartDataset {
  /** Prefixed to each line's label when several datasets are overlaid (e.g. "A", "B"). */
  name?: string;
  set: SeriesSet;
}

const DASHES: (number[] | undefined)[] = [undefined, [8, 4], [2, 3], [12, 3, 2, 3]];
const LINE_VARS = ['--wb-chart-1', '--wb-chart-2', '--wb-chart-3', '--wb-chart-4', '--wb-chart-5', '--wb-chart-6'];

interface Palette {
  lines: string[];
  axis: string;
  grid: string;
  mark: string;
}

/** The chart's colours from the page's own variables, so light and dark mode each get colours that read. */
function readPalette(el: HTMLElement): Palette {
  const css = getComputedStyle(el);
  const v = (name: string, fallback: string) => css.getPropertyValue(name).trim() || fallback;
  return {
    lines: LINE_VARS.map((name) => v(name, '#115e56')),
    axis: v('--wb-ink', '#17251e'),
    grid: v('--wb-line', '#d9d0bd'),
    mark: v('--wb-amber', '#9a5b00'),
  };
}

/** Re-reads the palette when the colour scheme changes (system setting or the page's own theme attribute). */
function useSchemeVersion(): number {
  const [version, setVersion] = useState(0);
  useEffect(() => {
    const media = window.matchMedia('(prefers-color-scheme: dark)');
    const bump = () => setVersion((n) => n + 1);
    media.addEventListener('change', bump);
    const observer = new MutationObserver(bump);
    observer.observe(document.documentElement, { attributes: true, attributeFilter: ['data-theme'] });
    return () => {
      media.removeEventListener('change', bump);
      observer.disconnect();
    };
  }, []);
  return version;
}

const NO_MARKS: ChartMark[] = [];

/** Legend values to about three significant figures: 1,600 rpm, 619.9 N, 0.123. */
const legendNumber = (v: number) => {
  const abs = Math.abs(v);
  return formatNumber(v, abs >= 100 ? 0 : abs >= 10 ? 1 : abs >= 1 ? 2 : 3);
};

const tick = (v: number) => formatNumber(v, Math.abs(v) >= 100 || Number.isInteger(v) ? 0 : 2);

/** Room for the widest tick value, so the axis title beside it is never drawn over or cut off. */
const tickAreaSize: uPlot.Axis.Size = (self, values, axisIdx, cycleNum) => {
  const axis = self.axes[axisIdx];
  if (cycleNum > 1) return (axis as unknown as { _size: number })._size;
  let size = (axis.ticks?.size ?? 10) + (axis.gap ?? 5);
  const longest = (values ?? []).reduce((a, b) => (String(b).length > a.length ? String(b) : a), '');
  if (longest) {
    self.ctx.font = (axis as unknown as { font: [string] }).font[0];
    size += self.ctx.measureText(longest).width / devicePixelRatio;
  }
  return Math.ceil(size) + 2;
};

/** Line chart of one or more series sets on a shared numeric x axis; units pick the left or right y axis. */
export default function LineChart({
  datasets,
  height = 300,
  title,
  marks = NO_MARKS,
}: {
  datasets: ChartDataset[];
  height?: number;
  title?: string;
  /** Vertical marks, e.g. the operating point, drawn as a dashed line with its label. */
  marks?: ChartMark[];
}) {
  const el = useRef<HTMLDivElement>(null);
  const still = useRef<HTMLImageElement>(null);
  const scheme = useSchemeVersion();

  useEffect(() => {
    const host = el.current;
    if (!host || datasets.length === 0) return;
    const palette = readPalette(host);
    host.dataset.colors = JSON.stringify(palette);
    const first = datasets[0].set;
    const units = [...new Set(datasets.flatMap((d) => d.set.y.map((y) => y.unit)))];
    const tables = datasets.map((d) => [d.set.x.values, ...d.set.y.map((y) => y.values)] as uPlot.AlignedData);
    const data = datasets.length === 1 ? tables[0] : uPlot.join(tables);
    // While nobody points at the chart the legend reads the operating point (or the last point), not a dash.
    const atX = marks[0]?.x;
    const resting = data.map((ys) => restingIndex(data[0], ys, atX));
    const atRest = (sidx: number) => {
      if (atX !== undefined) {
        const at = sidx === 0 ? atX : valueAt(data[0], data[sidx], atX);
        if (at !== null) return at;
      }
      const rest = resting[sidx];
      return rest == null ? null : (data[sidx][rest] ?? null);
    };
    const legendValue = (_u: uPlot, v: number | null, sidx: number, idx: number | null) => {
      const shown = idx == null ? atRest(sidx) : v;
      return shown == null ? '–' : legendNumber(shown);
    };
    const lines: uPlot.Series[] = [];
    datasets.forEach((d, di) =>
      d.set.y.forEach((y, yi) => {
        const scale = units.indexOf(y.unit) === 0 ? 'left' : 'right';
        lines.push({
          label: plainSymbols(`${d.name ? `${d.name}: ` : ''}${y.label}${y.unit ? ` (${y.unit})` : ''}`),
          stroke: palette.lines[yi % palette.lines.length], // one colour per quantity, so A and B match
          // Overlaid datasets differ by dash; lines within one dataset by colour and by dash too, never colour alone.
          dash: datasets.length > 1 ? DASHES[di % DASHES.length] : DASHES[yi % DASHES.length],
          width: 2,
          scale,
          spanGaps: true,
          value: legendValue,
        });
      }),
    );
    const axisStyle = {
      stroke: palette.axis,
      grid: { stroke: palette.grid, width: 1 },
      ticks: { stroke: palette.grid, width: 1 },
      size: tickAreaSize,
      values: (_u: uPlot, vals: number[]) => vals.map(tick),
    };
    const drawMarks = (u: uPlot) => {
      const ctx = u.ctx;
      const dpr = devicePixelRatio;
      ctx.save();
      ctx.strokeStyle = palette.mark;
      ctx.fillStyle = palette.axis;
      ctx.lineWidth = 2 * dpr;
      ctx.setLineDash([6 * dpr, 4 * dpr]);
      ctx.font = `${12 * dpr}px system-ui, sans-serif`;
      for (const m of marks) {
        const x = u.valToPos(m.x, 'x', true);
        if (x < u.bbox.left || x > u.bbox.left + u.bbox.width) continue;
        ctx.beginPath();
        ctx.moveTo(x, u.bbox.top);
        ctx.lineTo(x, u.bbox.top + u.bbox.height);
        ctx.stroke();
        const text = plainSymbols(m.label.split(':')[0]);
        const width = ctx.measureText(text).width;
        const right = x + 6 * dpr + width < u.bbox.left + u.bbox.width;
        ctx.textAlign = right ? 'left' : 'right';
        ctx.fillText(text, x + (right ? 6 : -6) * dpr, u.bbox.top + 14 * dpr);
      }
      ctx.restore();
      // A still copy for print: a printout gets the plot as an image, whatever the printer does with canvases.
      if (still.current) still.current.src = u.ctx.canvas.toDataURL('image/png');
    };
    const opts: uPlot.Options = {
      width: host.clientWidth || 600,
      height,
      scales: { x: { time: false }, left: {}, right: {} },
      series: [
        { label: plainSymbols(`${first.x.label}${first.x.unit ? ` (${first.x.unit})` : ''}`), value: legendValue },
        ...lines,
      ],
      axes: [
        { ...axisStyle, label: plainSymbols(`${first.x.label}${first.x.unit ? ` (${first.x.unit})` : ''}`) },
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
      hooks: { draw: [drawMarks] },
    };
    const chart = new uPlot(opts, data, host);
    const resize = new ResizeObserver(() => chart.setSize({ width: host.clientWidth, height }));
    resize.observe(host);
    return () => {
      resize.disconnect();
      chart.destroy();
    };
  }, [datasets, height, marks, scheme]);

  const first = datasets[0]?.set;
  const label = title ?? first?.title ?? 'Chart';
  return (
    <figure className="chart min-w-0 text-ink">
      <div
        ref={el}
        className="chart-canvas"
        role="img"
        aria-label={plainSymbols(
          `${label}: ${datasets.flatMap((d) => d.set.y.map((y) => y.label)).join(', ')} against ${first?.x.label ?? 'x'}${marks.length ? `; marked: ${marks.map((m) => m.label).join('; ')}` : ''}`,
        )}
      />
      <img ref={still} className="chart-still" alt="" />
      <figcaption className="mt-1 text-sm text-muted">
        <Sym text={label} />
        {marks.map((m) => (
          <span key={m.label} className="block">
            <span aria-hidden="true">┆ </span>
            <Sym text={m.label} />
          </span>
        ))}
        <span className="no-print block text-xs">
          The legend reads {marks.length > 0 ? 'the marked point' : 'the last point'}; point at or touch the chart to
          read another.
        </span>
      </figcaption>
      {first && <DataTable datasets={datasets} />}
    </figure>
  );
}

/** The chart's numbers as a table, for screen readers and for copying. */
function DataTable({ datasets }: { datasets: ChartDataset[] }) {
  return (
    <details className="no-print mt-2 text-sm">
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
                <Sym text={d.set.title} />
              </caption>
              <thead>
                <tr>
                  {[d.set.x, ...d.set.y].map((a) => (
                    <th key={a.name} scope="col" className="border border-line px-2 py-1 text-left">
                      <Sym text={a.label} />
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
