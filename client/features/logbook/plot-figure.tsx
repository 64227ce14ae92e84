import * as Plot from '@observablehq/plot';
import { useEffect, useRef } from 'react';
import { useNavigate } from 'react-router-dom';

/**
 * An Observable Plot chart. Marks may link their points (the `href` channel); a click on such a
 * link is handled by the router, so the page is not reloaded.
 */
export function PlotFigure({
  options,
  caption,
  testId,
}: {
  options: Plot.PlotOptions;
  caption: string;
  testId?: string;
}) {
  const ref = useRef<HTMLDivElement>(null);
  const navigate = useNavigate();
  useEffect(() => {
    const chart = Plot.plot({
      style: { background: 'transparent', fontFamily: 'var(--font-mono)', fontSize: '11px' },
      ...options,
    });
    // Plot names its mark groups with aria-label; give them a role that permits one.
    for (const group of chart.querySelectorAll('g[aria-label]'))
      group.setAttribute('role', 'group');
    ref.current?.replaceChildren(chart);
    return () => chart.remove();
  }, [options]);
  return (
    <figure className="rounded border border-rule bg-white/50 p-3" data-testid={testId}>
      <figcaption className="mb-2 text-sm font-medium">{caption}</figcaption>
      <div
        ref={ref}
        className="overflow-x-auto text-ink"
        onClick={(e) => {
          const link = (e.target as Element).closest('a');
          const href = link?.getAttribute('href');
          if (href?.startsWith('/')) {
            e.preventDefault();
            navigate(href);
          }
        }}
      />
    </figure>
  );
}
