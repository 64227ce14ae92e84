/**
 * Kernels written for the demo team's story, beside the engine's starters and examples
 * (sandbox/kernels): a back substitution with two partial sums (first without, then with the
 * zero-diagonal check), an LU with its row offsets hoisted, and an LU whose author forgot the
 * permutation, which the contract's type check refuses.
 */
export const inlineKernels = {
  'back-substitution-two-sums-unchecked': `/**
 * Back substitution with two partial sums per row, to shorten the dependency chain of the
 * inner loop. Row-major u (entry (i, j) at u[i*n + j]); b is overwritten with x.
 */
export function solve(u: Float64Array, b: Float64Array, n: number): Float64Array {
  for (let i = n - 1; i >= 0; i--) {
    const row = i * n;
    let even = b[i]!;
    let odd = 0;
    let j = i + 1;
    for (; j + 1 < n; j += 2) {
      even -= u[row + j]! * b[j]!;
      odd -= u[row + j + 1]! * b[j + 1]!;
    }
    if (j < n) even -= u[row + j]! * b[j]!;
    b[i] = (even + odd) / u[row + i]!;
  }
  return b;
}
`,
  'back-substitution-two-sums': `/**
 * Back substitution with two partial sums per row, to shorten the dependency chain of the
 * inner loop. Row-major u (entry (i, j) at u[i*n + j]); b is overwritten with x.
 * Throws when a diagonal entry is exactly zero (U is singular).
 */
export function solve(u: Float64Array, b: Float64Array, n: number): Float64Array {
  for (let i = n - 1; i >= 0; i--) {
    const row = i * n;
    const diagonal = u[row + i]!;
    if (diagonal === 0) throw new Error(\`singular: u[\${i}, \${i}] is zero\`);
    let even = b[i]!;
    let odd = 0;
    let j = i + 1;
    for (; j + 1 < n; j += 2) {
      even -= u[row + j]! * b[j]!;
      odd -= u[row + j + 1]! * b[j + 1]!;
    }
    if (j < n) even -= u[row + j]! * b[j]!;
    b[i] = (even + odd) / diagonal;
  }
  return b;
}
`,
  'lu-hoisted-row-offsets': `/**
 * Right-looking LU with partial pivoting, row offsets hoisted out of the inner loops.
 * Row-major a (entry (i, j) at a[i*n + j]), overwritten with L (strict lower) and U.
 * Row i of PA is row perm[i] of A. Throws on an exactly zero pivot.
 */
export function factor(a: Float64Array, n: number): { lu: Float64Array; perm: Int32Array } {
  const perm = new Int32Array(n);
  for (let i = 0; i < n; i++) perm[i] = i;
  for (let k = 0; k < n; k++) {
    const rowK = k * n;
    let p = k;
    let largest = Math.abs(a[rowK + k]!);
    for (let i = k + 1; i < n; i++) {
      const v = Math.abs(a[i * n + k]!);
      if (v > largest) {
        largest = v;
        p = i;
      }
    }
    if (largest === 0) throw new Error(\`singular matrix: column \${k} has no nonzero pivot\`);
    if (p !== k) {
      const rowP = p * n;
      for (let j = 0; j < n; j++) {
        const t = a[rowK + j]!;
        a[rowK + j] = a[rowP + j]!;
        a[rowP + j] = t;
      }
      const t = perm[k]!;
      perm[k] = perm[p]!;
      perm[p] = t;
    }
    const pivot = a[rowK + k]!;
    for (let i = k + 1; i < n; i++) {
      const rowI = i * n;
      const l = a[rowI + k]! / pivot;
      a[rowI + k] = l;
      for (let j = k + 1; j < n; j++) a[rowI + j] = a[rowI + j]! - l * a[rowK + j]!;
    }
  }
  return { lu: a, perm };
}
`,
  'lu-blocked-without-permutation': `/**
 * First sketch of a column-blocked LU with partial pivoting (block width 8).
 */
const WIDTH = 8;

export function factor(a: Float64Array, n: number): { lu: Float64Array } {
  for (let start = 0; start < n; start += WIDTH) {
    const stop = Math.min(start + WIDTH, n);
    for (let k = start; k < stop; k++) {
      const pivot = a[k * n + k]!;
      if (pivot === 0) throw new Error(\`zero pivot at column \${k}\`);
      for (let i = k + 1; i < n; i++) {
        const l = a[i * n + k]! / pivot;
        a[i * n + k] = l;
        for (let j = k + 1; j < n; j++) a[i * n + j] = a[i * n + j]! - l * a[k * n + j]!;
      }
    }
  }
  return { lu: a };
}
`,
} as const;

export type InlineKernelName = keyof typeof inlineKernels;
