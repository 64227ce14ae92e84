import type { Random } from '@sandbox/matrices/random.ts';

/**
 * A random orthogonal n×n matrix from the Haar distribution. Layout: row-major, entry (i, j) at
 * q[i*n + j]. Cost about 4n³ flops plus n² normal draws (taken row by row). Method: Z with
 * independent N(0, 1) entries, Householder QR Z = QR (Golub & Van Loan, 4th ed., Alg. 5.2.1, with
 * Q accumulated backwards as in §5.1.6), then Q·diag(sign r_jj): without that sign fix Q is not
 * Haar (G. W. Stewart, SIAM J. Numer. Anal. 17 (1980) 403–409; F. Mezzadri, Notices AMS 54 (2007)
 * 592–604; references §4.10).
 */
export function randomOrthogonal(n: number, random: Random): Float64Array {
  if (!Number.isInteger(n) || n < 1) throw new RangeError(`n must be a positive integer, got ${n}`);
  const z = new Float64Array(n * n);
  for (let k = 0; k < n * n; k++) z[k] = random.normal();
  // v holds the Householder vector of step k in rows k..n−1 of column k; beta[k] = 2/(vᵀv).
  const v = new Float64Array(n * n);
  const beta = new Float64Array(n);
  const sign = new Float64Array(n).fill(1);
  for (let k = 0; k < n; k++) {
    let ss = 0;
    for (let i = k; i < n; i++) ss += z[i * n + k]! * z[i * n + k]!;
    const norm = Math.sqrt(ss);
    if (norm === 0) continue; // H_k = I and r_kk = 0: keep the sign +1.
    const x0 = z[k * n + k]!;
    // r_kk = alpha = −sign(x0)·‖x‖, so v = x − alpha·e1 has no cancellation (GVL §5.1.2).
    const alpha = x0 >= 0 ? -norm : norm;
    sign[k] = alpha > 0 ? 1 : -1;
    let vv = 0;
    for (let i = k; i < n; i++) {
      const vi = i === k ? x0 - alpha : z[i * n + k]!;
      v[i * n + k] = vi;
      vv += vi * vi;
    }
    beta[k] = 2 / vv;
    for (let j = k + 1; j < n; j++) {
      let s = 0;
      for (let i = k; i < n; i++) s += v[i * n + k]! * z[i * n + j]!;
      const f = beta[k]! * s;
      for (let i = k; i < n; i++) z[i * n + j]! -= f * v[i * n + k]!;
    }
  }
  // Q = H_0 H_1 ⋯ H_{n−1}·I, accumulated from the last reflector backwards.
  const q = new Float64Array(n * n);
  for (let i = 0; i < n; i++) q[i * n + i] = 1;
  for (let k = n - 1; k >= 0; k--) {
    if (beta[k] === 0) continue;
    for (let j = k; j < n; j++) {
      let s = 0;
      for (let i = k; i < n; i++) s += v[i * n + k]! * q[i * n + j]!;
      const f = beta[k]! * s;
      for (let i = k; i < n; i++) q[i * n + j]! -= f * v[i * n + k]!;
    }
  }
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) q[i * n + j]! *= sign[j]!;
  return q;
}
