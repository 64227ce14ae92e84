import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { typeCheckerName } from '@sandbox/isolate/type-check-version.ts';
import { createDatabase, type Database } from '@server/db/client.ts';
import { revisions } from '@server/db/schema/revisions.ts';
import { routines } from '@server/db/schema/routines.ts';
import { trials } from '@server/db/schema/trials.ts';
import { loadTrialInput } from '@server/jobs/trial-inputs.ts';
import { createJobWorld, exampleSource, queueCandidateTrial, type JobWorld } from './job-world.ts';

let database: Database;
let world: JobWorld;
beforeAll(async () => {
  database = createDatabase(inject('databaseUrl'), 2);
  world = await createJobWorld(database.db, [{ family: 'uniform', n: 4, seed: 1 }], []);
});
afterAll(() => database.pool.end());

const source = () => exampleSource('lu-partial-pivoting-right-looking');

/** A queued trial whose revision was stored with `stored` as its check record. */
async function trialWith(stored: { checkedWith: string | null; errors: number }) {
  const db = database.db;
  const { revisionId, trialId } = await queueCandidateTrial(db, world, source());
  const diagnostics = Array.from({ length: stored.errors }, () => ({
    line: 1,
    column: 1,
    code: 'TS2322',
    message: 'Type mismatch.',
    file: 'kernel' as const,
  }));
  await db
    .update(revisions)
    .set({ checkedWith: stored.checkedWith, diagnostics })
    .where(eq(revisions.id, revisionId));
  const [trial] = await db.select().from(trials).where(eq(trials.id, trialId));
  return { trial: trial!, revisionId };
}

describe('loadTrialInput and the check done at submission', () => {
  it('lets the trial skip the check only for a revision that passed it with this TypeScript', async () => {
    const cases = [
      { stored: { checkedWith: typeCheckerName, errors: 0 }, skip: true },
      // Stored before the check was recorded: checked by the trial as before.
      { stored: { checkedWith: null, errors: 0 }, skip: false },
      // Checked with another version of the compiler: checked again.
      { stored: { checkedWith: 'TypeScript 0.0.1', errors: 0 }, skip: false },
      // Failed at submission: the trial checks it and fails, as product.md has it.
      { stored: { checkedWith: typeCheckerName, errors: 1 }, skip: false },
    ];
    for (const { stored, skip } of cases) {
      const { trial } = await trialWith(stored);
      const input = await loadTrialInput(database.db, trial);
      expect(input.candidateSource).toBe(source());
      expect(input.candidateTypeChecked, JSON.stringify(stored)).toBe(skip);
      expect(input.incumbentSource).toBeNull();
      expect(input.incumbentTypeChecked).toBe(false);
    }
  });

  it('says the same of the incumbent', async () => {
    const db = database.db;
    const incumbent = await trialWith({ checkedWith: typeCheckerName, errors: 0 });
    await db
      .update(routines)
      .set({ incumbentRevisionId: incumbent.revisionId })
      .where(eq(routines.id, world.routineId));
    const { trial } = await trialWith({ checkedWith: null, errors: 0 });
    const input = await loadTrialInput(db, trial);
    expect(input.incumbentSource).toBe(source());
    expect(input.incumbentTypeChecked).toBe(true);
    expect(input.candidateTypeChecked).toBe(false);
  });
});
