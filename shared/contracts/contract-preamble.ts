/**
 * The opening comment of every routine's contract text (product.md, "Routines and their
 * contracts"): the rules every kernel shares, whatever its routine. The text is TypeScript that
 * becomes `contract.d.ts` for the type checker and the editor's typings.
 */
export const contractPreamble = `/*
 * Stablehand kernel contract.
 *
 * Storage: dense row-major Float64Array; entry (i, j) of an m×n matrix is a[i*n + j].
 * Inputs: each call gets fresh copies; the kernel may overwrite them and may return them.
 * Results: exactly the typed arrays named below (Float64Array, Int32Array) with exactly the
 *   lengths stated; plain arrays, other typed arrays or other lengths are invalid output.
 *   Entries the checks do not read (for example above the diagonal of L) are ignored.
 * Failure: a kernel that detects a failure (an exactly zero pivot, a matrix that is not
 *   positive definite) throws an Error whose message says what and where. Returning NaN or
 *   Infinity instead is a silent failure.
 * Runtime: a self-contained, synchronous ES2022 module (an async function's Promise is invalid
 *   output). It runs alone in a bare isolate with memory and time limits: no imports (types
 *   from './contract' may be imported with "import type"), no console, timers or host objects.
 */
`;
