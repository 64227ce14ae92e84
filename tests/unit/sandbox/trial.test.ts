import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { exampleKernels, type ExampleName } from '@sandbox/kernels/example-catalog.ts';
import { generateMatrix } from '@sandbox/matrices/generate.ts';
import { namedSet } from '@sandbox/matrices/sets.ts';
import { materializeSet } from '@sandbox/trial/materialize-set.ts';
import { runTrial, type TrialInput } from '@sandbox/trial.ts';
import { trialReportSchema } from '@shared/trial-report.ts';

const source = (name: ExampleName) =>
  readFileSync(`sandbox/kernels/${exampleKernels[name].file}`, 'utf8');
const quick = materializeSet(namedSet('quick'), () => '');

/** runTrial of an LU candidate on the quick set without timing, unless `input` says otherwise. */
const trial = (candidateSource: string, input: Partial<TrialInput> = {}) =>
  runTrial({
    routine: 'lu-partial-pivoting',
    candidateSource,
    setName: 'quick',
    matrices: quick,
    timingSizes: [],
    ...input,
  });

describe('runTrial in one process', () => {
  it('survives an endless loop and a memory hog, then evaluates a sound kernel correctly', async () => {
    const loop = await trial(source('lu-endless-loop'), {
      matrices: quick.slice(0, 4),
      callTimeoutMs: 200,
    });
    expect(loop.status).toBe('trial-failed');
    expect(loop.matrices.every((m) => m.candidate.status === 'timeout')).toBe(true);

    const hog = await trial(source('lu-memory-hog'), { matrices: quick.slice(0, 2) });
    expect(hog.matrices[0]!.candidate.status).toBe('out-of-memory');

    const sound = await trial(source('lu-partial-pivoting-right-looking'), {
      incumbentSource: source('lu-partial-pivoting-right-looking'),
      timingSizes: [24],
      timingBudgetMs: 200,
    });
    expect(trialReportSchema.safeParse(sound).success).toBe(true);
    expect(sound.status).toBe('completed');
    expect(sound.verdict.passed).toBe(true);
    expect(sound.matrices.every((m) => m.passed)).toBe(true);
    expect(sound.timing[0]!.ratio).not.toBeNull();
  });

  it('stops calling a kernel after three timeouts in a row and says why', async () => {
    const report = await trial(source('lu-endless-loop'), {
      matrices: quick.slice(0, 6),
      callTimeoutMs: 100,
    });
    expect(
      report.matrices.slice(3).every((m) => m.candidate.message?.includes('3 matrices in a row')),
    ).toBe(true);
    // The skipped matrices were never handed to the kernel.
    expect(report.matrices.slice(3).every((m) => m.candidate.ms === 0)).toBe(true);
    expect(report.matrices.slice(0, 3).every((m) => m.candidate.ms > 0)).toBe(true);
  });

  it('reports a type error as a trial that could not run, with the line of the error', async () => {
    const report = await trial(
      'export function factor(a: Float64Array, n: number) {\n  const k: string = n;\n  return { l: a };\n}\n',
      { routine: 'cholesky' },
    );
    expect(report.status).toBe('trial-failed');
    expect(report.diagnostics.candidate.some((d) => d.line === 2 && d.code === 'TS2322')).toBe(
      true,
    );
    expect(report.verdict.passed).toBe(false);
  });

  it('skips matrices a routine does not apply to (QR gets tall matrices, Cholesky only symmetric ones)', async () => {
    const tall = generateMatrix({ family: 'tall-random', n: 6, m: 12, seed: 2 });
    const square = generateMatrix({ family: 'uniform', n: 6, seed: 2 });
    const two = { setName: 'two', matrices: [tall, square] };
    const qr = await trial(source('householder-qr-row-oriented'), {
      ...two,
      routine: 'householder-qr',
    });
    expect(qr.matrices.map((m) => [m.id, m.m, m.n])).toEqual([
      [tall.id, 12, 6],
      [square.id, 6, 6],
    ]);
    expect(qr.matrices[0]!.candidate.metrics.orthogonalityRatio).toBeLessThan(30);
    const chol = await trial(source('cholesky-row-oriented'), { ...two, routine: 'cholesky' });
    expect(chol.matrices).toEqual([]);
  });
});
