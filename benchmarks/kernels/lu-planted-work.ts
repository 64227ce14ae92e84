// A sound GEPP kernel for the timing calibration. With EXTRA_FRACTION = 0 it is a plain
// kernel; the benchmark raises EXTRA_FRACTION to plant extra work: before factoring, it also
// factors a scratch copy of the leading k×k block with k = round(n·∛EXTRA_FRACTION), which
// costs EXTRA_FRACTION of the kernel's 2n³/3 flops (to the rounding of k).
const EXTRA_FRACTION = 0;

function factorInPlace(w: Float64Array, n: number, stride: number, perm: Int32Array): void {
  for (let i = 0; i < n; i++) perm[i] = i;
  for (let k = 0; k < n; k++) {
    let p = k;
    let max = Math.abs(w[k * stride + k]!);
    for (let i = k + 1; i < n; i++) {
      const v = Math.abs(w[i * stride + k]!);
      if (v > max) {
        max = v;
        p = i;
      }
    }
    if (max === 0) throw new Error(`singular: zero pivot in column ${k}`);
    if (p !== k) {
      for (let j = 0; j < n; j++) {
        const t = w[k * stride + j]!;
        w[k * stride + j] = w[p * stride + j]!;
        w[p * stride + j] = t;
      }
      const t = perm[k]!;
      perm[k] = perm[p]!;
      perm[p] = t;
    }
    const pivot = w[k * stride + k]!;
    for (let i = k + 1; i < n; i++) {
      const l = w[i * stride + k]! / pivot;
      w[i * stride + k] = l;
      for (let j = k + 1; j < n; j++) w[i * stride + j]! -= l * w[k * stride + j]!;
    }
  }
}

export function factor(a: Float64Array, n: number): { lu: Float64Array; perm: Int32Array } {
  const k = Math.round(n * Math.cbrt(EXTRA_FRACTION));
  if (k > 0) {
    const block = new Float64Array(k * k);
    for (let i = 0; i < k; i++) block.set(a.subarray(i * n, i * n + k), i * k);
    try {
      factorInPlace(block, k, k, new Int32Array(k));
    } catch {
      // A singular leading block only shortens the planted work.
    }
  }
  const perm = new Int32Array(n);
  factorInPlace(a, n, n, perm);
  return { lu: a, perm };
}
