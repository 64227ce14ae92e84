import * as Plot from '@observablehq/plot';
import { useMemo } from 'react';
import { paths } from '@client/app/paths.ts';
import { formatMs, formatRatio } from '@client/components/number-format.ts';
import type { DriftCheck } from '@shared/api/logbook.ts';
import type { LogbookPoint } from './logbook-points.ts';
import { PlotFigure } from './plot-figure.tsx';

const sizeColours = ['#1d2b45', '#1f7a72', '#b7791f', '#c4432b', '#4a5872', '#7a5c99'];
const symbols = { promotion: 'circle', 'drift check': 'diamond' } as const;

interface ChartProps {
  points: readonly LogbookPoint[];
  driftChecks: readonly DriftCheck[];
  teamSlug: string;
  width: number;
}

/** The incumbents' worst accuracy ratio and timing per size over time, promotions marked. */
export function LogbookCharts({ points, driftChecks, teamSlug, width }: ChartProps) {
  const accuracy = useMemo<Plot.PlotOptions>(() => {
    const promotions = points.filter((p) => p.source === 'promotion');
    const measured = points.filter((p) => p.worstFactorRatio !== null && p.worstFactorRatio > 0);
    return {
      width,
      height: 260,
      marginLeft: 56,
      x: { type: 'utc', label: null },
      y: { type: 'log', label: 'worst factor ratio', grid: true, tickFormat: '.2~g' },
      symbol: { domain: ['promotion', 'drift check'], range: ['circle', 'diamond'], legend: true },
      marks: [
        Plot.ruleX(promotions, { x: 'at', stroke: '#d9cfbb', strokeDasharray: '3,3' }),
        Plot.text(promotions, {
          x: 'at',
          text: (d: LogbookPoint) => `r${d.revisionNumber ?? '?'}`,
          frameAnchor: 'top',
          dy: 4,
          fill: '#4a5872',
        }),
        Plot.line(measured, {
          x: 'at',
          y: 'worstFactorRatio',
          stroke: '#4a5872',
          curve: 'step-after',
        }),
        Plot.dot(measured, {
          x: 'at',
          y: 'worstFactorRatio',
          symbol: (d: LogbookPoint) => d.source,
          r: 5,
          fill: '#1d2b45',
          href: (d: LogbookPoint) => paths.trial(teamSlug, d.trialId),
          title: (d: LogbookPoint) =>
            `${d.label}\nworst factor ratio ${formatRatio(d.worstFactorRatio)}\ntrial #${d.trialId}`,
        }),
        ...driftRules(driftChecks),
      ],
    };
  }, [points, driftChecks, teamSlug, width]);

  const timing = useMemo<Plot.PlotOptions>(() => {
    const rows = points.flatMap((p) =>
      p.timing
        .filter((t) => t.medianMs !== null && t.medianMs > 0)
        .map((t) => ({ ...p, n: `n = ${t.n}`, size: t.n, medianMs: t.medianMs })),
    );
    const sizes = [...new Set(rows.map((r) => r.size))].sort((a, b) => a - b);
    return {
      width,
      height: 260,
      marginLeft: 56,
      x: { type: 'utc', label: null },
      y: { type: 'log', label: 'median time (ms)', grid: true, tickFormat: '.2~g' },
      color: {
        domain: sizes.map((n) => `n = ${n}`),
        range: sizeColours,
        legend: true,
      },
      marks: [
        Plot.ruleX(
          points.filter((p) => p.source === 'promotion'),
          { x: 'at', stroke: '#d9cfbb', strokeDasharray: '3,3' },
        ),
        Plot.line(rows, { x: 'at', y: 'medianMs', stroke: 'n', curve: 'step-after' }),
        Plot.dot(rows, {
          x: 'at',
          y: 'medianMs',
          stroke: 'n',
          fill: 'n',
          symbol: (d: LogbookPoint) => symbols[d.source],
          r: 4,
          href: (d: LogbookPoint) => paths.trial(teamSlug, d.trialId),
          title: (d: LogbookPoint & { n: string; medianMs: number }) =>
            `${d.label}\n${d.n}: median ${formatMs(d.medianMs)}\ntrial #${d.trialId}`,
        }),
        ...driftRules(driftChecks),
      ],
    };
  }, [points, driftChecks, teamSlug, width]);

  if (points.length === 0) return null;
  return (
    <div className="grid gap-4">
      <PlotFigure
        options={accuracy}
        testId="accuracy-chart"
        caption="Worst factor ratio of the incumbent (log scale). Dashed lines: promotions; red lines: drift alerts. Each mark links to its trial."
      />
      <PlotFigure
        options={timing}
        testId="timing-chart"
        caption="Median time per size of the incumbent (log scale). Each mark links to its trial."
      />
    </div>
  );
}

/** A vermilion rule where a drift check found the incumbent significantly worse. */
function driftRules(checks: readonly DriftCheck[]) {
  const drifted = checks.filter((c) => c.status === 'drifted');
  return [
    Plot.ruleX(drifted, {
      x: (c: DriftCheck) => new Date(c.finishedAt ?? c.createdAt),
      stroke: '#c4432b',
      strokeWidth: 1.5,
    }),
  ];
}
