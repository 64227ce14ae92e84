import { describe, expect, it } from 'vitest';
import { readKernelSource } from '@sandbox/kernels/read-kernel-source.ts';
import { namedSet } from '@sandbox/matrices/sets.ts';
import { materializeSet } from '@sandbox/trial/materialize-set.ts';
import { runTrial, type TrialInput } from '@sandbox/trial.ts';

const starter = readKernelSource('starters/lu-partial-pivoting.ts');
// Runs as well as the starter (esbuild strips the types), but breaks the contract's types.
const typeError = `${starter}\nexport const unused: number = 'not a number';\n`;
const matrices = materializeSet(namedSet('quick'), () => '').slice(0, 3);

const trial = (input: Partial<TrialInput>) =>
  runTrial({
    routine: 'lu-partial-pivoting',
    candidateSource: starter,
    setName: 'quick',
    matrices,
    timingSizes: [],
    ...input,
  });

describe('runTrial and the type check done at submission', () => {
  it('does not check again a candidate that passed the check when submitted', async () => {
    // The type error proves the check did not run: a checked source with it would fail.
    const report = await trial({ candidateSource: typeError, candidateTypeChecked: true });
    expect(report.status).toBe('completed');
    expect(report.diagnostics.candidate).toEqual([]);
    expect(report.matrices.every((m) => m.candidate.status === 'ok')).toBe(true);
  });

  it('checks an unchecked candidate, and a type error still fails the trial', async () => {
    for (const flag of [undefined, false]) {
      const report = await trial({ candidateSource: typeError, candidateTypeChecked: flag });
      expect(report.status).toBe('trial-failed');
      expect(report.diagnostics.candidate.map((d) => d.code)).toEqual(['TS2322']);
      expect(report.matrices).toEqual([]);
    }
  });

  it('skips or runs the incumbent check by its own flag', async () => {
    const skipped = await trial({ incumbentSource: typeError, incumbentTypeChecked: true });
    expect(skipped.message).toBeUndefined();
    expect(skipped.matrices.every((m) => m.incumbent?.status === 'ok')).toBe(true);
    const checked = await trial({ incumbentSource: typeError, candidateTypeChecked: true });
    expect(checked.message).toContain('The incumbent could not be loaded');
    expect(checked.diagnostics.incumbent.map((d) => d.code)).toEqual(['TS2322']);
  });
});
