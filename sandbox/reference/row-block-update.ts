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
 * For i in [i0, i1) and j in [j0, j1): w_ij ← w_ij − Σ_{p ∈ [p0, p1)} w_ip·s_{p−p0+s0, j},
 * subtracting term by term in increasing p. The multipliers w_ip sit in row i (columns
 * p0…p1−1); the source rows are rows s0… of s, n wide (by default s = w and s0 = p0, the rows
 * p0…p1−1 of w itself); sources and multipliers must not overlap the target block. Cost 2·(i1−i0)(p1−p0)(j1−j0)
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
  s: Float64Array = w,
  s0: number = p0,
): void {
  const shift = s0 - p0;
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
        const u0 = (p + shift) * n;
        const u1 = u0 + n;
        const u2 = u1 + n;
        const u3 = u2 + n;
        // Four columns per iteration: fewer loop tests and index updates per product
        // (measured 1.18× at n = 512; V8 does not unroll loops itself).
        let j = j0;
        for (; j + 4 <= j1; j += 4) {
          const a0 = s[u0 + j]!;
          const a1 = s[u1 + j]!;
          const a2 = s[u2 + j]!;
          const a3 = s[u3 + j]!;
          w[ri + j] = w[ri + j]! - l0 * a0 - l1 * a1 - l2 * a2 - l3 * a3;
          w[si + j] = w[si + j]! - m0 * a0 - m1 * a1 - m2 * a2 - m3 * a3;
          const b0 = s[u0 + j + 1]!;
          const b1 = s[u1 + j + 1]!;
          const b2 = s[u2 + j + 1]!;
          const b3 = s[u3 + j + 1]!;
          w[ri + j + 1] = w[ri + j + 1]! - l0 * b0 - l1 * b1 - l2 * b2 - l3 * b3;
          w[si + j + 1] = w[si + j + 1]! - m0 * b0 - m1 * b1 - m2 * b2 - m3 * b3;
          const c0 = s[u0 + j + 2]!;
          const c1 = s[u1 + j + 2]!;
          const c2 = s[u2 + j + 2]!;
          const c3 = s[u3 + j + 2]!;
          w[ri + j + 2] = w[ri + j + 2]! - l0 * c0 - l1 * c1 - l2 * c2 - l3 * c3;
          w[si + j + 2] = w[si + j + 2]! - m0 * c0 - m1 * c1 - m2 * c2 - m3 * c3;
          const d0 = s[u0 + j + 3]!;
          const d1 = s[u1 + j + 3]!;
          const d2 = s[u2 + j + 3]!;
          const d3 = s[u3 + j + 3]!;
          w[ri + j + 3] = w[ri + j + 3]! - l0 * d0 - l1 * d1 - l2 * d2 - l3 * d3;
          w[si + j + 3] = w[si + j + 3]! - m0 * d0 - m1 * d1 - m2 * d2 - m3 * d3;
        }
        for (; j < j1; j++) {
          const a0 = s[u0 + j]!;
          const a1 = s[u1 + j]!;
          const a2 = s[u2 + j]!;
          const a3 = s[u3 + j]!;
          w[ri + j] = w[ri + j]! - l0 * a0 - l1 * a1 - l2 * a2 - l3 * a3;
          w[si + j] = w[si + j]! - m0 * a0 - m1 * a1 - m2 * a2 - m3 * a3;
        }
      }
      for (; p < pe; p++) {
        const l = w[ri + p]!;
        const m = w[si + p]!;
        const up = (p + shift) * n;
        for (let j = j0; j < j1; j++) {
          const a = s[up + j]!;
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
        const u0 = (p + shift) * n;
        const u1 = u0 + n;
        const u2 = u1 + n;
        const u3 = u2 + n;
        let j = j0;
        for (; j + 2 <= j1; j += 2) {
          w[ri + j] =
            w[ri + j]! - l0 * s[u0 + j]! - l1 * s[u1 + j]! - l2 * s[u2 + j]! - l3 * s[u3 + j]!;
          const k = j + 1;
          w[ri + k] =
            w[ri + k]! - l0 * s[u0 + k]! - l1 * s[u1 + k]! - l2 * s[u2 + k]! - l3 * s[u3 + k]!;
        }
        if (j < j1)
          w[ri + j] =
            w[ri + j]! - l0 * s[u0 + j]! - l1 * s[u1 + j]! - l2 * s[u2 + j]! - l3 * s[u3 + j]!;
      }
      for (; p < pe; p++) {
        const l = w[ri + p]!;
        const up = (p + shift) * n;
        for (let j = j0; j < j1; j++) w[ri + j] = w[ri + j]! - l * s[up + j]!;
      }
    }
  }
}
