import { useEffect, useRef } from 'react';

/**
 * Mounts an Observable Plot figure (built by `render`) and rebuilds it when `deps` change.
 * The figure is decorative for screen readers; `label` and the tables carry the numbers.
 */
export function PlotFigure({
  render,
  label,
  deps,
}: {
  render: (width: number) => SVGSVGElement | HTMLElement;
  label: string;
  deps: readonly unknown[];
}) {
  const ref = useRef<HTMLDivElement>(null);
  useEffect(() => {
    const host = ref.current;
    if (!host) return;
    const width = Math.max(320, Math.min(host.clientWidth || 560, 720));
    const figure = render(width);
    // The wrapper is the image with its label; Plot's own labels on groups are not allowed there.
    figure.setAttribute('aria-hidden', 'true');
    figure.querySelectorAll('[aria-label]').forEach((el) => el.removeAttribute('aria-label'));
    host.replaceChildren(figure);
    return () => figure.remove();
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, deps);
  return <div ref={ref} role="img" aria-label={label} className="w-full overflow-x-auto" />;
}
