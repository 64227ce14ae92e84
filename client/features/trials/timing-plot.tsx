import * as Plot from '@observablehq/plot';
import type { TimingReport } from '@shared/trial-report.ts';
import { PlotFigure } from './plot-figure.tsx';
import { ratioTicks } from './ratio-ticks.ts';

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
