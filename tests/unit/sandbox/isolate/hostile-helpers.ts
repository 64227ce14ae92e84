import { expect } from 'vitest';
import { loadKernel, type LoadOptions } from '@sandbox/isolate/kernel-runner.ts';
import type { KernelInstance } from '@sandbox/isolate/kernel-instance.ts';
import { readKernelSource } from '@sandbox/kernels/read-kernel-source.ts';
import { starterKernelFiles } from '@sandbox/kernels/starter-kernels.ts';
import { randomMatrix } from '@tests/helpers/test-matrices.ts';
import { luRatio, RATIO_THRESHOLD } from '@tests/unit/sandbox/kernels/factor-checks.ts';

/** Small limits keep each hostile case fast: a timeout costs 300 ms. */
export const hostileLimits = { callTimeoutMs: 300, loadTimeoutMs: 300, memoryMb: 32 };

const loaded: KernelInstance[] = [];

/** Loads an lu-partial-pivoting kernel that must load; the instance is disposed by `cleanUp`. */
export async function loadHostile(
  source: string,
  options: Partial<LoadOptions<'lu-partial-pivoting'>> = {},
): Promise<KernelInstance<'lu-partial-pivoting'>> {
  const out = await loadKernel({
    source,
    routine: 'lu-partial-pivoting',
    limits: hostileLimits,
    ...options,
  });
  if (!out.ok) throw new Error(`${out.stage}: ${out.message} ${JSON.stringify(out.diagnostics)}`);
  loaded.push(out.kernel);
  return out.kernel;
}

export function cleanUp(): void {
  for (const kernel of loaded.splice(0)) kernel.dispose();
}

/** A 4×4 input; `n` other than 4 lets a kernel behave differently on one call. */
export const args = (n = 4) => ({ a: randomMatrix(n, n, 3), m: n, n });

/** The plain LU starter with its export renamed, for kernels that misbehave only sometimes. */
export const soundLu = () =>
  readKernelSource(starterKernelFiles['lu-partial-pivoting']).replace(
    'export function factor(',
    'function sound(',
  );

/** After a hostile kernel, this process must still load and run a sound kernel correctly. */
export async function expectSoundKernelRuns(): Promise<void> {
  const out = await loadKernel({
    source: soundLu().replace('function sound(', 'export function factor('),
    routine: 'lu-partial-pivoting',
    limits: hostileLimits,
  });
  if (!out.ok) throw new Error(out.message);
  const input = args(6);
  const call = await out.kernel.call(input);
  out.kernel.dispose();
  expect(call.status).toBe('ok');
  // Pass threshold 30: LAPACK TESTING/dtest.in.
  expect(luRatio(input.a, call.result!.lu, call.result!.perm, 6)).toBeLessThan(RATIO_THRESHOLD);
}
