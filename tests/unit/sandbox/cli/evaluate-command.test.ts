import { describe, expect, it } from 'vitest';
import { exampleKernels, type ExampleName } from '@sandbox/kernels/example-catalog.ts';
import { parseReport, runEvaluate } from '@tests/helpers/run-evaluate.ts';

const example = (name: ExampleName) => `sandbox/kernels/${exampleKernels[name].file}`;
const rule = (report: ReturnType<typeof parseReport>, id: string) =>
  report.verdict.rules.find((r) => r.rule === id)!;

const NO_TIMING = ['--no-timing'];

/** Runs `evaluate <example> --routine <routine> --json …flags` and parses the JSON report. */
async function evaluateJson(name: ExampleName, routine: string, flags = NO_TIMING) {
  const run = await runEvaluate([example(name), '--routine', routine, '--json', ...flags]);
  return { run, report: parseReport(run.stdout) };
}

// Each run is the real command in a child process: the JSON document, the exit code and the
// verdict are what a CI job would see.
describe('npm run evaluate --json on the example kernels', () => {
  const sound: ExampleName[] = [
    'lu-partial-pivoting-right-looking',
    'lu-no-pivoting-right-looking',
    'cholesky-row-oriented',
    'ldlt-row-oriented',
    'householder-qr-row-oriented',
    'back-substitution-row-oriented',
  ];
  it.each(sound)('passes the sound kernel %s on the quick set with exit code 0', async (name) => {
    const routine = exampleKernels[name].routine;
    const { run, report } = await evaluateJson(name, routine);
    expect(run.stderr).not.toMatch(/error:/);
    expect(run.code).toBe(0);
    expect(report.routine).toBe(routine);
    expect(report.status).toBe('completed');
    expect(report.matrices.length).toBeGreaterThan(5);
    expect(report.matrices.filter((m) => !m.passed).map((m) => m.id)).toEqual([]);
    expect(report.verdict.passed).toBe(true);
  });

  it('catches an unpivoted LU offered as pivoted on the tiny-pivot matrix', async () => {
    const { run, report } = await evaluateJson(
      'lu-no-pivoting-offered-as-pivoting',
      'lu-partial-pivoting',
    );
    expect(run.code).toBe(1);
    const accuracy = rule(report, 'factor-accuracy');
    expect(accuracy.passed).toBe(false);
    expect(accuracy.offenders).toContain('needs-row-exchange-n2');
    const trap = report.matrices.find((m) => m.id === 'needs-row-exchange-n2')!;
    // numerics.md: unpivoted LU of [[1e-20,1],[1,1]] gives factor ratio 2^51.
    expect(trap.candidate.metrics.factorRatio).toBeGreaterThan(1e14);
  });

  it.each(['lu-single-precision-updates', 'lu-pivots-identity-perm'] as const)(
    'fails %s on factor accuracy across ordinary matrices',
    async (name) => {
      const { run, report } = await evaluateJson(name, 'lu-partial-pivoting');
      expect(run.code).toBe(1);
      expect(
        rule(report, 'factor-accuracy').offenders.some((id) => id.startsWith('uniform-')),
      ).toBe(true);
    },
  );

  it('fails a Cholesky that does not detect an indefinite matrix on the rejection rule', async () => {
    const { run, report } = await evaluateJson('cholesky-no-definiteness-check', 'cholesky');
    expect(run.code).toBe(1);
    const rejections = rule(report, 'rejections');
    expect(rejections.passed).toBe(false);
    expect(rejections.offenders.some((id) => id.startsWith('indefinite'))).toBe(true);
  });

  it('records an endless loop as timeouts and the trial as failed to run', async () => {
    const { run, report } = await evaluateJson('lu-endless-loop', 'lu-partial-pivoting', [
      ...NO_TIMING,
      '--call-timeout',
      '300',
    ]);
    expect(run.code).toBe(1);
    expect(report.status).toBe('trial-failed');
    expect(new Set(report.matrices.map((m) => m.candidate.status))).toEqual(new Set(['timeout']));
  });

  it('records a memory hog as out-of-memory', async () => {
    const { run, report } = await evaluateJson('lu-memory-hog', 'lu-partial-pivoting');
    expect(run.code).toBe(1);
    expect(report.matrices[0]!.candidate.status).toBe('out-of-memory');
  });

  it('finds nothing of the host for a kernel that probes for it', async () => {
    const { report } = await evaluateJson('lu-host-probe', 'lu-partial-pivoting');
    expect(report.matrices[0]!.candidate.status).toBe('threw');
    expect(report.matrices[0]!.candidate.message).toContain('host probe found nothing');
  });

  it('calls a much slower loop order slower at n = 256, and says so in the timing rule', async () => {
    const { run, report } = await evaluateJson('lu-column-stride', 'lu-partial-pivoting', [
      '--against',
      example('lu-partial-pivoting-right-looking'),
      '--set',
      'tests/fixtures/sets/timing-256.json',
    ]);
    expect(report.timing).toHaveLength(1);
    expect(report.timing[0]!.verdict).toBe('slower');
    expect(report.timing[0]!.ratio!).toBeGreaterThan(1.2);
    expect(rule(report, 'timing').passed).toBe(false);
    expect(rule(report, 'factor-accuracy').passed).toBe(true);
    expect(run.code).toBe(1);
  });

  it('reads a set with a Matrix Market file and judges the uploaded matrix too', async () => {
    const { run, report } = await evaluateJson(
      'lu-partial-pivoting-right-looking',
      'lu-partial-pivoting',
      ['--set', 'tests/fixtures/matrix-market/set-with-file.json'],
    );
    expect(run.code).toBe(0);
    expect(report.matrices.map((m) => m.id)).toEqual(['hilbert-n6', 'file-general-5x5']);
    expect(report.matrices[1]!.family).toBe('file');
  });

  it('prints a readable table without --json', async () => {
    const run = await runEvaluate([
      example('lu-partial-pivoting-right-looking'),
      '--routine',
      'lu-partial-pivoting',
      '--no-timing',
    ]);
    expect(run.code).toBe(0);
    expect(run.stdout).toMatch(/hilbert-n8\s+8\s/);
    expect(run.stdout).toContain('Verdict: PASSED');
  });

  it.each([
    [['--routine', 'lu-partial-pivoting'], 'Give exactly one kernel file'],
    [['k.ts', '--routine', 'gaussian'], 'Unknown routine "gaussian"'],
    [['k.ts'], '--routine is required'],
    [['no-such-file.ts', '--routine', 'cholesky'], 'no-such-file.ts'],
    [
      [example('cholesky-row-oriented'), '--routine', 'cholesky', '--set', 'no-such-set.json'],
      'no-such-set.json',
    ],
  ])('exits 2 with a message on stderr for %j', async (args, message) => {
    const run = await runEvaluate(args);
    expect(run.code).toBe(2);
    expect(run.stderr).toContain(message);
    expect(run.stdout).toBe('');
  });
});
