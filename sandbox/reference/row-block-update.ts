/**
 * The inner kernel of the reference solver's blocked factorisations: a trailing-block update
 * on dense row-major n×n storage (entry (i, j) is w[i*n + j]) that subtracts, for each entry,
 * the products with a block of finished rows one at a time, in increasing row order — the same
 * operations in the same order as the unblocked right-looking loop, so the blocked routines
 * return bit-for-bit the unblocked ones' results on finite input. Speed comes from loop shape
 * only: two target rows share each load of four source rows (register reuse), all accesses run
 * along rows (subarray-free flat indexing measured faster than row views here), and the source
 * rows are taken in chunks of ROW_CHUNK so they stay in the first-level cache. See
 * benchmarks/README.md for the measurements behind these choices.
 */

/** Source rows per pass over a target row (common practice: 32 rows of a 512-wide row = 128 KB L2). */
const ROW_CHUNK = 32;

/**
 * For i in [i0, i1) and j in [j0, j1): w_ij ← w_ij − Σ_{p ∈ [p0, p1)} w_ip·w_pj, subtracting term
 * by term in increasing p. The multipliers w_ip sit in row i (columns p0…p1−1), the source rows
 * p in rows p0…p1−1; the ranges must not overlap the target block. Cost 2·(i1−i0)(p1−p0)(j1−j0)
 * flops. No argument checks: callers are the blocked factorisations of this folder.
 */
export function subtractRowProducts(
  w: Float64Array,
  n: number,
  i0: number,
  i1: number,
  p0: number,
  p1: number,
  j0: number,
  j1: number,
): void {
  for (let pc = p0; pc < p1; pc += ROW_CHUNK) {
    const pe = Math.min(p1, pc + ROW_CHUNK);
    let i = i0;
    for (; i + 2 <= i1; i += 2) {
      const ri = i * n;
      const si = ri + n;
      let p = pc;
      for (; p + 4 <= pe; p += 4) {
        const l0 = w[ri + p]!;
        const l1 = w[ri + p + 1]!;
        const l2 = w[ri + p + 2]!;
        const l3 = w[ri + p + 3]!;
        const m0 = w[si + p]!;
        const m1 = w[si + p + 1]!;
        const m2 = w[si + p + 2]!;
        const m3 = w[si + p + 3]!;
        const u0 = p * n;
        const u1 = u0 + n;
        const u2 = u1 + n;
        const u3 = u2 + n;
        for (let j = j0; j < j1; j++) {
          const a0 = w[u0 + j]!;
          const a1 = w[u1 + j]!;
          const a2 = w[u2 + j]!;
          const a3 = w[u3 + j]!;
          w[ri + j] = w[ri + j]! - l0 * a0 - l1 * a1 - l2 * a2 - l3 * a3;
          w[si + j] = w[si + j]! - m0 * a0 - m1 * a1 - m2 * a2 - m3 * a3;
        }
      }
      for (; p < pe; p++) {
        const l = w[ri + p]!;
        const m = w[si + p]!;
        const up = p * n;
        for (let j = j0; j < j1; j++) {
          const a = w[up + j]!;
          w[ri + j] = w[ri + j]! - l * a;
          w[si + j] = w[si + j]! - m * a;
        }
      }
    }
    for (; i < i1; i++) {
      // A lone target row (the odd last row, and every row of a triangular solve): four source
      // rows per pass, so that each load and store of the target serves four products.
      const ri = i * n;
      let p = pc;
      for (; p + 4 <= pe; p += 4) {
        const l0 = w[ri + p]!;
        const l1 = w[ri + p + 1]!;
        const l2 = w[ri + p + 2]!;
        const l3 = w[ri + p + 3]!;
        const u0 = p * n;
        const u1 = u0 + n;
        const u2 = u1 + n;
        const u3 = u2 + n;
        for (let j = j0; j < j1; j++)
          w[ri + j] =
            w[ri + j]! - l0 * w[u0 + j]! - l1 * w[u1 + j]! - l2 * w[u2 + j]! - l3 * w[u3 + j]!;
      }
      for (; p < pe; p++) {
        const l = w[ri + p]!;
        const up = p * n;
        for (let j = j0; j < j1; j++) w[ri + j] = w[ri + j]! - l * w[up + j]!;
      }
    }
  }
}
