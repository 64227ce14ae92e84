/**
 * The blocked step of the reference Householder QR: the compact WY form of a panel's reflectors,
 * H_{k0} … H_{k1−1} = I − V T Vᵀ (Schreiber & Van Loan, SIAM J. Sci. Stat. Comput. 10(1), 1989;
 * LAPACK DLARFT and DLARFB), and its application to the trailing columns. Dense row-major m×n
 * storage, entry (i, j) at w[i*n + j], V below the diagonal of the panel's columns as
 * householder-qr.ts stores it. No argument checks: the caller is householderQr.
 */
import { subtractRowProducts } from '@sandbox/reference/row-block-update.ts';

/** v_p's entry in row i (p = k0 + c): 1 on the diagonal, 0 above it, the stored value below. */
function reflectorEntry(w: Float64Array, n: number, i: number, p: number): number {
  return i === p ? 1 : i < p ? 0 : w[i * n + p]!;
}

/**
 * T (nb×nb, upper triangular, row-major) with H_{k0} … H_{k1−1} = I − V T Vᵀ, LAPACK DLARFT's
 * forward column-wise recurrence: T_cc = τ_c, T(0:c, c) = −τ_c T(0:c, 0:c) (V(:, 0:c)ᵀ v_c).
 */
export function formT(
  w: Float64Array,
  m: number,
  n: number,
  k0: number,
  k1: number,
  tau: Float64Array,
  t: Float64Array,
  nb: number,
): void {
  const b = k1 - k0;
  t.fill(0);
  const z = new Float64Array(b);
  for (let c = 0; c < b; c++) {
    const tc = tau[k0 + c]!;
    t[c * nb + c] = tc;
    if (tc === 0 || c === 0) continue;
    z.fill(0, 0, c);
    for (let i = k0 + c; i < m; i++) {
      const vc = reflectorEntry(w, n, i, k0 + c);
      if (vc === 0) continue;
      for (let q = 0; q < c; q++) z[q] = z[q]! + reflectorEntry(w, n, i, k0 + q) * vc;
    }
    for (let r = 0; r < c; r++) {
      let s = 0;
      for (let q = r; q < c; q++) s += t[r * nb + q]! * z[q]!;
      t[r * nb + c] = -tc * s;
    }
  }
}

/**
 * A(k0:m, k1:n) ← A − V Tᵀ… applied as Qᵀ A with Q = I − V T Vᵀ: W = Vᵀ A (row by row of A),
 * W ← Tᵀ W, then A(i, :) −= Σ_c V(i, c) W(c, :) row by row. wt holds W, nb rows of stride n.
 */
export function applyBlockReflector(
  w: Float64Array,
  m: number,
  n: number,
  k0: number,
  k1: number,
  t: Float64Array,
  nb: number,
  wt: Float64Array,
): void {
  const b = k1 - k0;
  wt.fill(0);
  // W = Vᵀ A₂: rows k0…k1−1 of A have a triangular V part; rows from k1 on have a full one.
  for (let i = k0; i < k1; i++) {
    const ri = i * n;
    const cEnd = Math.min(b, i - k0 + 1);
    let c = 0;
    for (; c + 4 <= cEnd; c += 4) {
      const v0 = reflectorEntry(w, n, i, k0 + c);
      const v1 = reflectorEntry(w, n, i, k0 + c + 1);
      const v2 = reflectorEntry(w, n, i, k0 + c + 2);
      const v3 = reflectorEntry(w, n, i, k0 + c + 3);
      const w0 = c * n;
      const w1 = w0 + n;
      const w2 = w1 + n;
      const w3 = w2 + n;
      for (let j = k1; j < n; j++) {
        const x = w[ri + j]!;
        wt[w0 + j] = wt[w0 + j]! + v0 * x;
        wt[w1 + j] = wt[w1 + j]! + v1 * x;
        wt[w2 + j] = wt[w2 + j]! + v2 * x;
        wt[w3 + j] = wt[w3 + j]! + v3 * x;
      }
    }
    for (; c < cEnd; c++) {
      const v = reflectorEntry(w, n, i, k0 + c);
      const wc = c * n;
      for (let j = k1; j < n; j++) wt[wc + j] = wt[wc + j]! + v * w[ri + j]!;
    }
  }
  accumulateFullRows(w, m, n, k0, k1, wt);
  // W ← Tᵀ W, row c of the result = Σ_{q ≤ c} T_qc W_q; from the last row up, in place.
  for (let c = b - 1; c >= 0; c--) {
    const wc = c * n;
    const tcc = t[c * nb + c]!;
    for (let j = k1; j < n; j++) wt[wc + j] = wt[wc + j]! * tcc;
    for (let q = 0; q < c; q++) {
      const tqc = t[q * nb + c]!;
      if (tqc === 0) continue;
      const wq = q * n;
      for (let j = k1; j < n; j++) wt[wc + j] = wt[wc + j]! + tqc * wt[wq + j]!;
    }
  }
  // A₂ −= V W: the triangular rows of V one by one, then the rows k1…m−1, where V is full,
  // through the row-block kernel with W's rows as the source rows.
  for (let i = k0; i < k1; i++) {
    const ri = i * n;
    for (let c = 0; c <= i - k0; c++) {
      const v = reflectorEntry(w, n, i, k0 + c);
      const wc = c * n;
      for (let j = k1; j < n; j++) w[ri + j] = w[ri + j]! - v * wt[wc + j]!;
    }
  }
  subtractRowProducts(w, n, k1, m, k0, k1, k1, n, wt, 0);
}

/**
 * W(c, :) += Σ_i V(i, c) A(i, k1:n) over the rows i ≥ k1, where V is stored in full in columns
 * k0…k1−1. Four rows of A go into two rows of W per pass (each load of W serves four products,
 * each row of A stays in cache for all of W), adding the rows in increasing order one at a
 * time, as the row-by-row loop does, so the sums are the same numbers.
 */
function accumulateFullRows(
  w: Float64Array,
  m: number,
  n: number,
  k0: number,
  k1: number,
  wt: Float64Array,
): void {
  const b = k1 - k0;
  let i = k1;
  for (; i + 4 <= m; i += 4) {
    const r0 = i * n;
    const r1 = r0 + n;
    const r2 = r1 + n;
    const r3 = r2 + n;
    let c = 0;
    for (; c + 2 <= b; c += 2) {
      const p = k0 + c;
      const a0 = w[r0 + p]!;
      const a1 = w[r1 + p]!;
      const a2 = w[r2 + p]!;
      const a3 = w[r3 + p]!;
      const b0 = w[r0 + p + 1]!;
      const b1 = w[r1 + p + 1]!;
      const b2 = w[r2 + p + 1]!;
      const b3 = w[r3 + p + 1]!;
      const wc = c * n;
      const wd = wc + n;
      // Two columns per iteration (V8 does not unroll loops; as in row-block-update.ts).
      let j = k1;
      for (; j + 2 <= n; j += 2) {
        const x0 = w[r0 + j]!;
        const x1 = w[r1 + j]!;
        const x2 = w[r2 + j]!;
        const x3 = w[r3 + j]!;
        wt[wc + j] = wt[wc + j]! + a0 * x0 + a1 * x1 + a2 * x2 + a3 * x3;
        wt[wd + j] = wt[wd + j]! + b0 * x0 + b1 * x1 + b2 * x2 + b3 * x3;
        const y0 = w[r0 + j + 1]!;
        const y1 = w[r1 + j + 1]!;
        const y2 = w[r2 + j + 1]!;
        const y3 = w[r3 + j + 1]!;
        wt[wc + j + 1] = wt[wc + j + 1]! + a0 * y0 + a1 * y1 + a2 * y2 + a3 * y3;
        wt[wd + j + 1] = wt[wd + j + 1]! + b0 * y0 + b1 * y1 + b2 * y2 + b3 * y3;
      }
      if (j < n) {
        const x0 = w[r0 + j]!;
        const x1 = w[r1 + j]!;
        const x2 = w[r2 + j]!;
        const x3 = w[r3 + j]!;
        wt[wc + j] = wt[wc + j]! + a0 * x0 + a1 * x1 + a2 * x2 + a3 * x3;
        wt[wd + j] = wt[wd + j]! + b0 * x0 + b1 * x1 + b2 * x2 + b3 * x3;
      }
    }
    for (; c < b; c++) {
      const p = k0 + c;
      const a0 = w[r0 + p]!;
      const a1 = w[r1 + p]!;
      const a2 = w[r2 + p]!;
      const a3 = w[r3 + p]!;
      const wc = c * n;
      for (let j = k1; j < n; j++)
        wt[wc + j] =
          wt[wc + j]! + a0 * w[r0 + j]! + a1 * w[r1 + j]! + a2 * w[r2 + j]! + a3 * w[r3 + j]!;
    }
  }
  for (; i < m; i++) {
    const ri = i * n;
    for (let c = 0; c < b; c++) {
      const v = w[ri + k0 + c]!;
      const wc = c * n;
      for (let j = k1; j < n; j++) wt[wc + j] = wt[wc + j]! + v * w[ri + j]!;
    }
  }
}
