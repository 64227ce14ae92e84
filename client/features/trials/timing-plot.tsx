import * as Plot from '@observablehq/plot';
import type { TimingReport } from '@shared/trial-report.ts';
import { PlotFigure } from './plot-figure.tsx';

interface Row {
  n: string;
  ratio: number;
  lo: number;
  hi: number;
  verdict: string;
}

const verdictColour: Record<string, string> = {
  faster: '#1f7a72',
  slower: '#c4432b',
  'no clear difference': '#b7791f',
};

/** Tick values from finer to coarser steps; the first set that fits the domain uncrowded wins. */
const tickSets = [
  [0.6, 0.7, 0.8, 0.9, 1, 1.1, 1.2, 1.3, 1.4, 1.6],
  [0.25, 0.5, 0.75, 1, 1.5, 2, 3],
  [0.1, 0.2, 0.5, 1, 2, 5, 10],
  [0.001, 0.01, 0.1, 1, 10, 100, 1000],
];

/**
 * Ticks for the ratio axis on [lo, hi]: at least two inside the domain, and on the log scale no
 * two closer than an eighth of the domain's width, so that their labels do not collide.
 */
function ratioTicks(lo: number, hi: number): number[] {
  const span = Math.log10(hi / lo);
  for (const set of tickSets) {
    const inside = set.filter((t) => t >= lo && t <= hi);
    const gaps = inside.slice(1).map((t, i) => Math.log10(t / inside[i]!));
    if (inside.length >= 2 && Math.min(...gaps) >= span / 8) return inside;
  }
  return tickSets.at(-1)!.filter((t) => t >= lo && t <= hi);
}

/** The time ratio (candidate ÷ incumbent) per size with its 95 % interval, around 1.0×. */
export function TimingPlot({ timing }: { timing: readonly TimingReport[] }) {
  const rows: Row[] = timing
    .filter((t) => t.ratio !== null && t.ci95 !== null)
    .map((t) => ({
      n: String(t.n),
      ratio: t.ratio!,
      lo: t.ci95![0],
      hi: t.ci95![1],
      verdict: t.verdict ?? 'no clear difference',
    }));
  if (rows.length === 0) {
    return (
      <p className="text-sm text-ink-soft">
        No size has a time ratio (there is no incumbent to compare with, or timing did not run).
      </p>
    );
  }
  const lo = Math.min(0.8, ...rows.map((r) => r.lo)) / 1.05;
  const hi = Math.max(1.25, ...rows.map((r) => r.hi)) * 1.05;
  const ticks = ratioTicks(lo, hi);
  return (
    <PlotFigure
      label={`Time ratio candidate over incumbent per size, with 95 % intervals: ${rows
        .map((r) => `n ${r.n}: ${r.ratio.toFixed(2)}×`)
        .join(', ')}`}
      deps={[timing]}
      render={(width) =>
        Plot.plot({
          width,
          height: 60 + rows.length * 42,
          marginLeft: 64,
          // The labels sit in the right margin, past the axis's end, so a large ratio cannot
          // push its label off the figure.
          marginRight: 200,
          style: {
            background: 'transparent',
            fontFamily: 'IBM Plex Mono, monospace',
            fontSize: '11px',
          },
          x: { type: 'log', domain: [lo, hi] },
          y: { label: 'size n', domain: rows.map((r) => r.n) },
          marks: [
            // An axis of our own: on a log scale Plot lets d3 blank the labels of ticks whose
            // leading digit is above 5 (0.8×, 0.9×), which left 1× the only label near 1.
            Plot.gridX(ticks),
            Plot.axisX(ticks, {
              text: (d: number) => `${Number(d.toPrecision(2))}×`,
              label: 'time ratio, candidate ÷ incumbent (left of 1.0× is faster) →',
            }),
            Plot.ruleX([1], { stroke: '#1d2b45', strokeOpacity: 0.6 }),
            Plot.ruleY(rows, {
              y: 'n',
              x1: 'lo',
              x2: 'hi',
              stroke: (d: Row) => verdictColour[d.verdict] ?? '#4a5872',
              strokeWidth: 4,
              strokeOpacity: 0.55,
            }),
            Plot.dot(rows, {
              y: 'n',
              x: 'ratio',
              fill: (d: Row) => verdictColour[d.verdict] ?? '#4a5872',
              r: 4,
            }),
            Plot.text(rows, {
              y: 'n',
              frameAnchor: 'right',
              text: (d: Row) => `${d.ratio.toFixed(2)}× ${d.verdict}`,
              dx: 10,
              textAnchor: 'start',
              fill: '#1d2b45',
            }),
          ],
        })
      }
    />
  );
}
