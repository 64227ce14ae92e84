import { existsSync } from 'node:fs';
import { afterAll, describe, expect, it } from 'vitest';
import { loadKernel } from '@sandbox/isolate/kernel-runner.ts';
import { namedSet } from '@sandbox/matrices/sets.ts';
import { materializeSet } from '@sandbox/trial/materialize-set.ts';
import { runTrial } from '@sandbox/trial.ts';
import type { CallStatus } from '@shared/routines.ts';
import { trialReportSchema, type TrialReport } from '@shared/trial-report.ts';
import {
  args,
  expectSoundKernelRuns,
  hostileLimits,
} from '@tests/unit/sandbox/isolate/hostile-helpers.ts';
import { luRatio, RATIO_THRESHOLD } from '@tests/unit/sandbox/kernels/factor-checks.ts';
import { hostileKernels, lu, type HostileKernel } from '@tests/hardening/hostile-kernel-cases.ts';
import { suiteTally } from '@tests/hardening/suite-tally.ts';

const routine = 'lu-partial-pivoting';
const tally = suiteTally('hostile kernels');
/** An 8×8 and a 10×10 matrix of the quick set: enough to see a kernel misbehave on the larger. */
const matrices = materializeSet(namedSet('quick'), () => '').slice(0, 2);
const escapeFile = '/tmp/stablehand-escaped';

/** The host's built-ins a kernel might try to reach: their own property names, and Math.abs. */
function hostSnapshot(): string {
  const typedProto = Object.getPrototypeOf(Int8Array.prototype) as object;
  const owners = {
    Array: Array.prototype,
    Object: Object.prototype,
    Float64Array: Float64Array.prototype,
    TypedArray: typedProto,
    String: String.prototype,
    Math,
    Reflect,
  };
  const names = Object.entries(owners).map(
    ([k, v]) => `${k}:${Reflect.ownKeys(v).map(String).sort().join(',')}`,
  );
  return [...names, `globals:${Object.keys(globalThis).sort().join(',')}`, Math.abs(-2)].join('\n');
}
const hostBefore = hostSnapshot();

/** The runner: load, then the case's calls (and timing) on small inputs. */
async function throughRunner(c: HostileKernel): Promise<void> {
  const out = await loadKernel({ source: c.source, routine, limits: hostileLimits });
  if (c.load) {
    expect(out.ok).toBe(false);
    if (out.ok) return;
    expect(out.stage).toBe(c.load.stage);
    if (c.load.status) expect(out.status).toBe(c.load.status);
    expect(out.message).toMatch(c.load.message);
    return;
  }
  if (!out.ok) throw new Error(`the kernel should load: ${out.stage}: ${out.message}`);
  const kernel = out.kernel;
  try {
    for (const expected of [c.call, c.large]) {
      if (!expected) continue;
      const n = expected === c.large ? c.large.n : (c.call?.n ?? 4);
      const input = args(n);
      const original = Float64Array.from(input.a);
      const result = await kernel.call(input);
      const statuses = ([] as CallStatus[]).concat(expected.status);
      expect(statuses).toContain(result.status);
      if (expected.message) expect(result.message).toMatch(expected.message);
      else expect(result.message).toBeUndefined();
      // Nothing the kernel did to its copy reaches the host's array.
      expect(input.a).toEqual(original);
      if (result.status === 'ok') {
        // Pass threshold 30: LAPACK TESTING/dtest.in (dget01's ratio).
        const { lu, perm } = result.result!;
        expect(luRatio(original, lu, perm, n)).toBeLessThan(RATIO_THRESHOLD);
      }
    }
    if (c.time) {
      const timed = await kernel.time(args(4), { repeat: c.time.repeat ?? 1 });
      if (c.time.status === 'ok') expect(timed.ok).toBe(true);
      else {
        expect(timed).toMatchObject({ ok: false, status: c.time.status });
        if (!timed.ok && c.time.message) expect(timed.message).toMatch(c.time.message);
      }
    }
  } finally {
    kernel.dispose();
  }
}

/** What runTrial must report for the case, on the two matrices. */
function expectTrial(c: HostileKernel, report: TrialReport): void {
  expect(trialReportSchema.safeParse(report).success).toBe(true);
  const statuses = report.matrices.map((m) => m.candidate.status);
  if (c.load) {
    expect(report.status).toBe('trial-failed');
    expect(report.message).toMatch(/^the candidate did not compile: /);
  } else if (c.call && c.call.status !== 'ok') {
    const expected = ([] as CallStatus[]).concat(c.call.status);
    expect(report.status).toBe('trial-failed');
    expect(report.message).toMatch(/^the kernel produced no result on any matrix \(first: /);
    expect(statuses.every((s) => expected.includes(s))).toBe(true);
  } else if ((c.large && c.large.status !== 'ok') || c.time) {
    // Sound on some input, hostile on another: the trial notices and the verdict fails.
    expect(report.verdict.passed).toBe(false);
    expect(statuses.some((s) => s !== 'ok') || report.timing.some((t) => t.message)).toBe(true);
  } else {
    expect(report.status).toBe('completed');
    expect(statuses).toEqual(['ok', 'ok']);
  }
}

describe('hostile kernels through the kernel runner and runTrial', () => {
  afterAll(() => tally.print());

  it('has at least 40 distinct cases', () => {
    expect(new Set(hostileKernels.map((c) => c.name)).size).toBe(hostileKernels.length);
    expect(hostileKernels.length).toBeGreaterThanOrEqual(40);
  });

  it.each(hostileKernels.map((c) => [c.name, c] as const))('%s', async (_name, c) => {
    tally.tried();
    await throughRunner(c);
    const report = await runTrial({
      routine,
      candidateSource: c.source,
      setName: 'quick',
      matrices,
      timingSizes: c.time ? [6] : [],
      timingBudgetMs: 100,
      callTimeoutMs: hostileLimits.callTimeoutMs,
      memoryLimitMb: hostileLimits.memoryMb,
    });
    expectTrial(c, report);
    // The process is unharmed: the host's built-ins are untouched, nothing was written, and the
    // next kernel in this process loads and factors correctly.
    expect(hostSnapshot()).toBe(hostBefore);
    expect(existsSync(escapeFile)).toBe(false);
    await expectSoundKernelRuns();
    tally.held();
  });

  it("runTrial applies the trial's memory limit to the isolate", async () => {
    tally.tried();
    // 24 MB of scratch on every call: over a 16 MB limit, well under 64 MB.
    const source = lu(
      'const scratch = new Float64Array(3 << 20);\nscratch[0] = n;\nreturn sound(a, n);',
    );
    const run = (memoryLimitMb: number) =>
      runTrial({
        routine,
        candidateSource: source,
        setName: 'quick',
        matrices,
        timingSizes: [],
        memoryLimitMb,
      });
    const small = await run(16);
    expect(small.matrices.map((m) => m.candidate.status)).toEqual([
      'out-of-memory',
      'out-of-memory',
    ]);
    const roomy = await run(64);
    expect(roomy.matrices.map((m) => m.candidate.status)).toEqual(['ok', 'ok']);
    tally.held();
  });
});
