import { afterAll, describe, expect, it } from 'vitest';
import { typeCheckKernel } from '@sandbox/isolate/type-check.ts';
import { createTypeCheckPool, typeCheckWorkerUrl } from '@sandbox/isolate/type-check-pool.ts';
import { typeCheckerName } from '@sandbox/isolate/type-check-version.ts';
import { readKernelSource } from '@sandbox/kernels/read-kernel-source.ts';

const starter = readKernelSource('starters/lu-partial-pivoting.ts');
const wrong = `export function factor(a: Float64Array, n: string) {\n  return { lu: a, perm: new Int32Array(0) };\n}\n`;

/** A long but valid kernel: the starter followed by many typed helper functions. */
function largeKernel(helpers: number): string {
  const lines = [starter];
  for (let i = 0; i < helpers; i++) {
    lines.push(
      `export function helper${i}(x: Float64Array, k: number): number {`,
      `  let s = 0;`,
      `  for (let j = 0; j < x.length; j++) s += x[j]! * (k + ${i});`,
      `  return s;`,
      `}`,
    );
  }
  return lines.join('\n');
}

/** Counts how often a 1 ms timer fires on this thread while `work` is pending. */
async function timerTicksDuring(work: () => Promise<unknown> | unknown): Promise<number> {
  let ticks = 0;
  const timer = setInterval(() => ticks++, 1);
  try {
    await work();
  } finally {
    clearInterval(timer);
  }
  return ticks;
}

const pool = createTypeCheckPool({ threads: 1 });
afterAll(() => pool.close());

describe('createTypeCheckPool', () => {
  it('answers what typeCheckKernel answers, and names the checker', async () => {
    const [good, bad] = await Promise.all([
      pool.check(starter, 'lu-partial-pivoting'),
      pool.check(wrong, 'lu-partial-pivoting'),
    ]);
    expect(good.diagnostics).toEqual([]);
    expect(good.checkedWith).toBe(typeCheckerName);
    expect(typeCheckerName).toMatch(/^TypeScript \d+\.\d+\.\d+$/);
    expect(bad.diagnostics).toEqual(typeCheckKernel(wrong, 'lu-partial-pivoting').diagnostics);
    expect(bad.diagnostics[0]).toMatchObject({ line: 1, code: 'TS2322', file: 'kernel' });
  });

  it('keeps this thread free while a large kernel is checked, unlike a check on this thread', async () => {
    const source = largeKernel(400);
    expect(source.length).toBeLessThan(200_000);
    // On this thread the check runs to its end before any timer can fire.
    const blockedTicks = await timerTicksDuring(() =>
      typeCheckKernel(source, 'lu-partial-pivoting'),
    );
    expect(blockedTicks).toBe(0);
    let outcome: Awaited<ReturnType<typeof pool.check>> | undefined;
    const freeTicks = await timerTicksDuring(async () => {
      outcome = await pool.check(source, 'lu-partial-pivoting');
    });
    expect(outcome!.diagnostics).toEqual([]);
    expect(freeTicks).toBeGreaterThan(0);
  });

  it('cuts off a check that runs past its time limit with a diagnostic', async () => {
    // A fresh thread parses the lib files first (about 800 ms, stack.md §6), far past 1 ms.
    const hasty = createTypeCheckPool({ threads: 1, timeoutMs: 1 });
    try {
      const outcome = await hasty.check(starter, 'lu-partial-pivoting');
      expect(outcome.diagnostics).toHaveLength(1);
      expect(outcome.diagnostics[0]).toMatchObject({
        line: 1,
        column: 1,
        code: 'type-check-cut-off',
        file: 'kernel',
      });
      expect(outcome.diagnostics[0]!.message).toContain('did not finish within 0.001 s');
    } finally {
      await hasty.close();
    }
  });

  it('refuses an oversized source in the thread as typeCheckKernel does', async () => {
    const outcome = await pool.check(starter, 'lu-partial-pivoting', { maxSourceBytes: 100 });
    expect(outcome.diagnostics.map((d) => d.code)).toEqual(['source-too-large']);
  });
});

describe('typeCheckWorkerUrl', () => {
  it('loads the TypeScript entry through tsx from source, and the bundled entry when built', () => {
    expect(typeCheckWorkerUrl('file:///app/sandbox/isolate/type-check-pool.ts').href).toBe(
      'file:///app/sandbox/isolate/type-check-worker-tsx.mjs',
    );
    expect(typeCheckWorkerUrl('file:///app/dist/server/main.js').href).toBe(
      'file:///app/dist/server/type-check-worker.js',
    );
  });
});
