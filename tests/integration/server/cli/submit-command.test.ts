import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { eq } from 'drizzle-orm';
import { pino } from 'pino';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { loadEnv } from '@server/config/env.ts';
import { candidates } from '@server/db/schema/candidates.ts';
import { routines } from '@server/db/schema/routines.ts';
import { teams } from '@server/db/schema/teams.ts';
import { createPgBossQueue, type PgBossQueue } from '@server/jobs/pg-boss-queue.ts';
import { startTrialWorker } from '@server/jobs/trial-worker.ts';
import type { MatrixSpec } from '@sandbox/matrices/reference-matrix.ts';
import { startTestApp, type RunningApp } from '@tests/helpers/test-app.ts';
import { createJobWorld, type JobWorld } from '../jobs/job-world.ts';
import { trialRow } from '../jobs/trial-readers.ts';
import { runSubmit } from './run-submit.ts';

// The command in a process of its own against the app on a free loopback port, with a real
// pg-boss worker in this process (in a pg-boss schema of its own, so other test files never
// see these jobs).
const tinySet: MatrixSpec[] = [
  { family: 'uniform', n: 8, seed: 1 },
  { family: 'hilbert', n: 6 },
  { family: 'singular', n: 6 },
];
const kernel = (name: string) => path.resolve(`sandbox/kernels/examples/${name}.ts`);

describe('npm run submit', () => {
  let app: RunningApp;
  let queue: PgBossQueue;
  let world: JobWorld;
  let routineArg: string;

  beforeAll(async () => {
    const databaseUrl = inject('databaseUrl');
    queue = await createPgBossQueue({
      databaseUrl,
      logger: pino({ level: 'silent' }),
      schema: 'pgboss_submit_command',
      trialJobs: { retryDelaySeconds: 1 },
    });
    app = await startTestApp(databaseUrl, undefined, {}, queue);
    await startTrialWorker({
      boss: queue.boss,
      queue,
      db: app.database.db,
      env: loadEnv({}),
      logger: pino({ level: 'silent' }),
      limits: { callTimeoutMs: 2_000, memoryLimitMb: 64 },
    });
    world = await createJobWorld(app.database.db, tinySet, [16]);
    const [team] = await app.database.db.select().from(teams).where(eq(teams.id, world.teamId));
    const [routine] = await app.database.db
      .select()
      .from(routines)
      .where(eq(routines.id, world.routineId));
    routineArg = `${team!.slug}/${routine!.slug}`;
  });

  afterAll(async () => {
    await queue?.boss.stop({ graceful: false, wait: true });
    await app?.close();
  });

  const submitAs = (token: string, args: string[]) =>
    runSubmit(args, { STABLEHAND_TOKEN: token, STABLEHAND_URL: app.url });

  /** The trial id from the command's `trial: <url>/teams/<team>/trials/<id>` line (its page). */
  const trialIdIn = (stdout: string) => {
    const team = routineArg.split('/')[0]!;
    const match = new RegExp(`^trial: +${app.url}/teams/${team}/trials/(\\d+)$`, 'm').exec(stdout);
    expect(match, stdout).not.toBeNull();
    return Number(match![1]);
  };

  it('submits a sound kernel, follows its trial and exits 0 with the verdict rule by rule', async () => {
    const run = await submitAs(world.author.token, [
      kernel('lu-partial-pivoting-right-looking'),
      '--routine',
      routineArg,
      '--title',
      'Right-looking LU from the command line',
    ]);
    expect(run.code, run.stderr).toBe(0);
    expect(run.stdout).toMatch(
      /^candidate \d+ "Right-looking LU from the command line", revision 1$/m,
    );
    expect(run.stdout).toContain('type check: no problems');
    expect(run.stdout).toMatch(/^trial \d+ queued$/m);
    // The finished event is always printed, whatever progress came before it.
    expect(run.stdout).toMatch(/^completed$/m);
    expect(run.stdout).toMatch(/^verdict: PASSED$/m);
    expect(run.stdout).toMatch(/^ {2}pass {2}factor-accuracy: /m);
    expect(run.stdout).toMatch(/^ {2}pass {2}rejections: /m);
    expect(run.stdout).not.toContain('FAIL');

    const trial = await trialRow(app.database.db, trialIdIn(run.stdout));
    expect(trial.status).toBe('completed');
    expect(trial.passed).toBe(true);
  });

  it('exits 1 for a flawed kernel, naming the rule it breaks, then 0 for a sound revision', async () => {
    const flawed = await submitAs(world.author.token, [
      kernel('lu-pivots-identity-perm'),
      '--routine',
      routineArg,
    ]);
    expect(flawed.code, flawed.stderr).toBe(1);
    // Without --title the file's name is the title.
    expect(flawed.stdout).toMatch(/^candidate (\d+) "lu-pivots-identity-perm.ts", revision 1$/m);
    expect(flawed.stdout).toMatch(/^verdict: FAILED$/m);
    // The kernel's permutation is wrong, so its factors do not reproduce PA on the uniform matrix.
    expect(flawed.stdout).toMatch(/^ {2}FAIL {2}factor-accuracy: .*uniform-n8-s1/m);
    const failedTrial = await trialRow(app.database.db, trialIdIn(flawed.stdout));
    expect(failedTrial.passed).toBe(false);

    const candidateId = Number(/^candidate (\d+) /m.exec(flawed.stdout)![1]);
    const revised = await submitAs(world.author.token, [
      kernel('lu-partial-pivoting-right-looking'),
      '--routine',
      routineArg,
      '--candidate',
      String(candidateId),
    ]);
    expect(revised.code, revised.stderr).toBe(0);
    expect(revised.stdout).toMatch(new RegExp(`^candidate ${candidateId} .*, revision 2$`, 'm'));
    expect(revised.stdout).toMatch(/^verdict: PASSED$/m);
    const [row] = await app.database.db
      .select({ state: candidates.state })
      .from(candidates)
      .where(eq(candidates.id, candidateId));
    expect(row!.state).toBe('in-review');
  });

  it('exits 1 and prints the diagnostics when the kernel does not meet its contract', async () => {
    const dir = mkdtempSync(path.join(tmpdir(), 'stablehand-submit-'));
    const file = path.join(dir, 'wrong-signature.ts');
    writeFileSync(file, 'export function factor(a: string): number {\n  return a.length;\n}\n');
    const run = await submitAs(world.author.token, [file, '--routine', routineArg]);
    expect(run.code).toBe(1);
    expect(run.stdout).toMatch(/^type check: \d+ errors?$/m);
    expect(run.stdout).toContain(`${file}:1:`);
    expect(run.stdout).toContain('rejected: the kernel does not meet its contract');
    expect(run.stdout).not.toMatch(/^trial:/m);
    expect(run.stdout).toMatch(
      new RegExp(`^candidate: +${app.url}/teams/${routineArg.split('/')[0]}/candidates/\\d+$`, 'm'),
    );
  });

  it('exits 1 with a clear message for a token the server does not know', async () => {
    const run = await submitAs('shk_not-a-real-token', [
      kernel('lu-partial-pivoting-right-looking'),
      '--routine',
      routineArg,
    ]);
    expect(run.code).toBe(1);
    expect(run.stderr).toContain('401 unauthenticated');
    expect(run.stderr).toContain('Check STABLEHAND_TOKEN');
    expect(run.stdout).toBe('');
  });

  it('exits 1 naming the routine when the caller has no such routine', async () => {
    const run = await submitAs(world.author.token, [
      kernel('lu-partial-pivoting-right-looking'),
      '--routine',
      `${routineArg.split('/')[0]}/no-such-routine`,
    ]);
    expect(run.code).toBe(1);
    expect(run.stderr).toContain('has no routine "no-such-routine"');
  });

  // Every refusal of the argument parser is in tests/unit/server/cli/submit-args.test.ts; these
  // check that the command turns them (and a missing file) into exit code 2 and the usage.
  it.each([
    ['no kernel file', ['--routine', 'a-team/a-routine'], 'Give exactly one kernel file.'],
    [
      'an unknown option',
      [kernel('lu-endless-loop'), '--routine', 'a-b/c-d', '--fast'],
      "'--fast'",
    ],
  ])('exits 2 with the usage for %s', async (_what, args, message) => {
    const run = await submitAs(world.author.token, args);
    expect(run.code).toBe(2);
    expect(run.stderr).toContain(message);
    expect(run.stderr).toContain('Usage: npm run submit --');
    expect(run.stdout).toBe('');
  });

  it('exits 2 when the kernel file cannot be read', async () => {
    const missing = path.resolve('no-such-kernel.ts');
    const run = await submitAs(world.author.token, [missing, '--routine', routineArg]);
    expect(run.code).toBe(2);
    expect(run.stderr).toContain(`Cannot read the kernel file ${missing} (ENOENT)`);
  });

  it('exits 2 when STABLEHAND_TOKEN is not set', async () => {
    const run = await runSubmit([kernel('lu-endless-loop'), '--routine', routineArg], {
      STABLEHAND_URL: app.url,
    });
    expect(run.code).toBe(2);
    expect(run.stderr).toContain('Set STABLEHAND_TOKEN');
  });
});
