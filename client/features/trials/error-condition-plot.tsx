import * as Plot from '@observablehq/plot';
import type { MatrixReport } from '@shared/trial-report.ts';
import { PlotFigure } from './plot-figure.tsx';
import { unitRoundoff } from './unit-roundoff.ts';

interface Point {
  matrix: string;
  kernel: 'candidate' | 'incumbent';
  condition: number;
  forwardError: number;
}

const usable = (x: number | null | undefined): x is number =>
  typeof x === 'number' && Number.isFinite(x) && x > 0;

export function errorConditionPoints(matrices: readonly MatrixReport[]): Point[] {
  const points: Point[] = [];
  for (const m of matrices) {
    if (!usable(m.condition)) continue;
    for (const kernel of ['candidate', 'incumbent'] as const) {
      const fe = m[kernel]?.metrics.forwardError;
      if (usable(fe))
        points.push({ matrix: m.id, kernel, condition: m.condition, forwardError: fe });
    }
  }
  return points;
}

/**
 * Forward error against the condition number, both on log scales, one mark per matrix for
 * each kernel, with the line κ·u: a backward-stable solve lands near or below it.
 */
export function ErrorConditionPlot({ matrices }: { matrices: readonly MatrixReport[] }) {
  const points = errorConditionPoints(matrices);
  if (points.length === 0) {
    return (
      <p className="text-sm text-ink-soft">
        No matrix has both a finite condition number and a trusted forward error to plot.
      </p>
    );
  }
  const kappas = points.map((p) => p.condition);
  const lo = Math.min(...kappas);
  const hi = Math.max(...kappas);
  const line = [
    { condition: lo, bound: lo * unitRoundoff },
    { condition: hi, bound: hi * unitRoundoff },
  ];
  return (
    <PlotFigure
      label={`Forward error against condition number, log–log, ${points.length} marks, with the line κ·u`}
      deps={[matrices]}
      render={(width) =>
        Plot.plot({
          width,
          height: 340,
          marginLeft: 56,
          style: {
            background: 'transparent',
            fontFamily: 'IBM Plex Mono, monospace',
            fontSize: '11px',
          },
          x: {
            type: 'log',
            label: 'condition number κ₁ →',
            grid: true,
            ticks: 6,
            tickFormat: '.0e',
          },
          y: { type: 'log', label: '↑ forward error', grid: true, ticks: 6, tickFormat: '.0e' },
          color: {
            domain: ['candidate', 'incumbent'],
            range: ['#1d2b45', '#b7791f'],
            legend: true,
          },
          symbol: { domain: ['candidate', 'incumbent'], range: ['circle', 'diamond'] },
          marks: [
            Plot.line(line, {
              x: 'condition',
              y: 'bound',
              stroke: '#c4432b',
              strokeDasharray: '4,3',
            }),
            Plot.text([line[1]!], {
              x: 'condition',
              y: 'bound',
              text: () => 'κ·u',
              dx: -4,
              dy: -8,
              textAnchor: 'end',
              fill: '#c4432b',
            }),
            Plot.dot(points, {
              x: 'condition',
              y: 'forwardError',
              stroke: 'kernel',
              fill: (d: Point) => (d.kernel === 'candidate' ? '#1d2b45' : 'none'),
              symbol: 'kernel',
              r: 3.5,
              tip: true,
              title: (d: Point) =>
                `${d.matrix} (${d.kernel})\nκ = ${d.condition.toExponential(1)}\nforward error = ${d.forwardError.toExponential(1)}`,
            }),
          ],
        })
      }
    />
  );
}
