/** Small measuring helpers shared by the benchmarks (timing of host-side calls, medians, fits). */
import { median } from '@sandbox/stats/quantiles.ts';

export { median };

/** Milliseconds taken by one call of f (host clock). */
export function timeCall(f: () => unknown): number {
  const t0 = performance.now();
  f();
  return performance.now() - t0;
}

/** Least-squares slope of log y against log x: the exponent p in y ≈ c·xᵖ. */
export function fitExponent(x: readonly number[], y: readonly number[]): number {
  const lx = x.map(Math.log);
  const ly = y.map(Math.log);
  const mx = lx.reduce((s, v) => s + v, 0) / lx.length;
  const my = ly.reduce((s, v) => s + v, 0) / ly.length;
  let num = 0;
  let den = 0;
  for (let i = 0; i < lx.length; i++) {
    num += (lx[i]! - mx) * (ly[i]! - my);
    den += (lx[i]! - mx) ** 2;
  }
  return num / den;
}

/** Rounds for display: 3 significant digits. */
export const fmt = (v: number | null | undefined): string =>
  v === null || v === undefined || !Number.isFinite(v) ? '—' : Number(v.toPrecision(3)).toString();
