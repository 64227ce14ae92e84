/**
 * Tick sets for a time-ratio axis, finer to coarser; each holds 1 so that 1× is always marked.
 * Steps near 1 first (ratios of two kernels mostly sit there), then 1–2–5 and decades.
 */
const tickSets: readonly (readonly number[])[] = [
  [0.5, 0.6, 0.7, 0.8, 0.9, 1, 1.1, 1.2, 1.3, 1.4, 1.5, 1.6, 1.7, 1.8, 1.9, 2],
  [0.4, 0.5, 0.6, 0.8, 1, 1.2, 1.5, 2, 2.5, 3],
  [0.25, 0.5, 0.75, 1, 1.5, 2, 3, 4],
  [0.1, 0.2, 0.5, 1, 2, 5, 10],
  [0.01, 0.1, 1, 10, 100],
  [1e-4, 1e-2, 1, 1e2, 1e4],
];

/**
 * Tick values for a log-scaled ratio axis on [lo, hi] (0 < lo < 1 < hi): the finest set that puts
 * at least three ticks inside the domain with no two closer than an eighth of its width on the
 * log scale, so that the labels do not collide. With no such set, the ticks of the coarsest one.
 */
export function ratioTicks(lo: number, hi: number): number[] {
  // A domain a log scale cannot draw has no ticks worth placing; 1× alone keeps the axis honest.
  if (!(lo > 0 && hi > lo && Number.isFinite(hi))) return [1];
  const minGap = Math.log10(hi / lo) / 8;
  const inside = (set: readonly number[]) => set.filter((t) => t >= lo && t <= hi);
  for (const set of tickSets) {
    const ticks = inside(set);
    const gaps = ticks.slice(1).map((t, i) => Math.log10(t / ticks[i]!));
    if (ticks.length >= 3 && Math.min(...gaps) >= minGap) return ticks;
  }
  return inside(tickSets[tickSets.length - 1]!);
}
