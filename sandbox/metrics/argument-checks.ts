/**
 * Argument checks shared by the metric modules. Bad arguments are programming errors of the
 * caller and throw RangeError naming the argument (style.md, Numerical code); bad numbers inside
 * well-shaped arguments are data and are scored, never thrown.
 */

/** Throws unless `value` is a non-negative integer (a matrix order or dimension). */
export function checkDimension(name: string, value: number): void {
  if (!Number.isInteger(value) || value < 0)
    throw new RangeError(`${name} must be a non-negative integer, got ${value}`);
}

/** Throws unless `array` holds exactly `length` entries. */
export function checkLength(name: string, array: ArrayLike<number>, length: number): void {
  if (array.length !== length)
    throw new RangeError(`${name} must hold ${length} entries, has ${array.length}`);
}

/** Throws unless `perm` is a permutation of 0, …, n−1 (product.md: row i of PA is row perm[i] of A). */
export function checkPermutation(perm: ArrayLike<number>, n: number): void {
  checkLength('perm', perm, n);
  const seen = new Uint8Array(n);
  for (let i = 0; i < n; i++) {
    const p = perm[i]!;
    if (!Number.isInteger(p) || p < 0 || p >= n || seen[p] === 1)
      throw new RangeError(`perm must be a permutation of 0..${n - 1}; entry ${i} is ${p}`);
    seen[p] = 1;
  }
}
