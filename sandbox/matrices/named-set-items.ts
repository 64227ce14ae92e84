import type { MatrixSpec } from '@sandbox/matrices/reference-matrix.ts';
import type { MatrixSetItem } from '@sandbox/matrices/sets.ts';

/** The items of the built-in matrix sets (sets.ts, namedSet). */

function g(
  family: MatrixSpec['family'],
  n: number,
  extra: Omit<MatrixSpec, 'family' | 'n'> = {},
): MatrixSetItem {
  return { kind: 'generated', spec: { family, n, ...extra } };
}

/**
 * quick: every family at n ≤ 12 and every trap — a must-reject matrix for each routine that can
 * reject (Householder QR never should), a tiny and a zero leading pivot, ill-conditioned, graded,
 * worst-growth (both tie variants), scaling extremes — so a trial runs in well under a second.
 */
export const quickItems: MatrixSetItem[] = [
  g('uniform', 8, { seed: 1 }),
  g('normal', 10, { seed: 2 }),
  g('diagonally-dominant', 8, { seed: 1 }),
  g('diagonally-dominant', 8, { seed: 2, params: { upper: 1 } }),
  g('spd-random', 8, { seed: 1 }),
  g('prescribed-condition', 10, { seed: 1, params: { cond: 1e10 } }),
  g('hilbert', 8),
  g('pascal', 8),
  g('lehmer', 8),
  g('minij', 8),
  g('moler', 8),
  g('frank', 8),
  g('kahan', 12),
  g('worst-growth', 12),
  g('worst-growth', 12, { params: { alpha: 0.5 } }),
  g('poisson-1d', 10),
  g('poisson-2d', 9),
  g('vandermonde', 6),
  g('graded', 10, { seed: 1 }),
  g('near-overflow', 6, { seed: 1 }),
  g('near-underflow', 6, { seed: 1 }),
  g('needs-row-exchange', 2),
  g('needs-row-exchange', 6, { params: { pivot: 0 } }),
  g('needs-row-exchange', 3, { params: { pivot: 1 } }),
  g('singular', 2),
  g('singular', 6),
  g('nearly-singular', 3),
  g('indefinite', 10),
  g('indefinite', 10, { params: { sigma: 1.1 } }),
  g('tall-random', 6, { m: 12, seed: 1 }),
];

/**
 * standard: every family at a few sizes, most at n ≤ 64 and a handful at 128–256, so that one LU
 * trial (candidate, incumbent and reference) stays around a minute.
 */
export const standardItems: MatrixSetItem[] = [
  g('uniform', 16, { seed: 1 }),
  g('uniform', 64, { seed: 2 }),
  g('uniform', 256, { seed: 3 }),
  g('normal', 32, { seed: 1 }),
  g('normal', 100, { seed: 2 }),
  g('diagonally-dominant', 48, { seed: 1 }),
  g('diagonally-dominant', 64, { seed: 2, params: { upper: 1 } }),
  g('spd-random', 32, { seed: 1 }),
  g('spd-random', 128, { seed: 2 }),
  g('prescribed-condition', 50, { seed: 1, params: { cond: 1e2 } }),
  g('prescribed-condition', 50, { seed: 2, params: { cond: 1e8 } }),
  g('prescribed-condition', 64, { seed: 3, params: { cond: 1e12 } }),
  g('prescribed-condition', 128, { seed: 4 }),
  g('hilbert', 6),
  g('hilbert', 10),
  g('hilbert', 14),
  g('pascal', 10),
  g('pascal', 20),
  g('pascal', 29),
  g('lehmer', 20),
  g('lehmer', 64),
  g('minij', 30),
  g('minij', 100),
  g('moler', 10),
  g('moler', 30),
  g('frank', 10),
  g('frank', 20),
  g('kahan', 30),
  g('kahan', 100),
  g('worst-growth', 20),
  g('worst-growth', 40, { params: { alpha: 0.5 } }),
  g('worst-growth', 60),
  g('poisson-1d', 50),
  g('poisson-1d', 200),
  g('poisson-2d', 64),
  g('poisson-2d', 256),
  g('vandermonde', 8),
  g('vandermonde', 12),
  g('graded', 32, { seed: 1 }),
  g('graded', 128, { seed: 2 }),
  g('near-overflow', 32, { seed: 1 }),
  g('near-underflow', 32, { seed: 1 }),
  g('needs-row-exchange', 2),
  g('needs-row-exchange', 32),
  g('needs-row-exchange', 16, { params: { pivot: 0 } }),
  g('needs-row-exchange', 16, { params: { pivot: 1 } }),
  g('singular', 2),
  g('singular', 20),
  g('nearly-singular', 3),
  g('nearly-singular', 16),
  g('nearly-singular', 3, { params: { delta: 0 } }),
  g('indefinite', 10),
  g('indefinite', 11),
  g('indefinite', 50, { params: { sigma: 1.1 } }),
  g('indefinite', 64, { params: { sigma: 0.5 } }),
  g('tall-random', 32, { m: 64, seed: 1 }),
  g('tall-random', 100, { m: 300, seed: 2 }),
];
