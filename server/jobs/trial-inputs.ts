import { performance } from 'node:perf_hooks';
import { eq } from 'drizzle-orm';
import { acceptancePolicySchema } from '@shared/acceptance-policy.ts';
import { typeCheckerName } from '@sandbox/isolate/type-check-version.ts';
import type { TrialInput } from '@sandbox/trial.ts';
import type { Db } from '@server/db/client.ts';
import { matrixSets } from '@server/db/schema/matrix-sets.ts';
import { revisions } from '@server/db/schema/revisions.ts';
import { routines } from '@server/db/schema/routines.ts';
import type { TrialRow } from './finished-trial.ts';
import { TrialCannotRun } from './trial-cannot-run.ts';
import { buildSetMatrices } from './trial-matrices.ts';

/** What the engine needs of a trial, read from the database; the worker adds its limits. */
export type TrialEngineInput = Pick<
  TrialInput,
  | 'routine'
  | 'candidateSource'
  | 'incumbentSource'
  | 'candidateTypeChecked'
  | 'incumbentTypeChecked'
  | 'setName'
  | 'matrices'
  | 'matricesMs'
  | 'timingSizes'
  | 'policy'
>;

interface StoredKernel {
  source: string;
  /** It passed the type check at submission, with the checker this process would use. */
  typeChecked: boolean;
}

async function kernelOf(db: Db, revisionId: number): Promise<StoredKernel | null> {
  const [row] = await db
    .select({
      source: revisions.source,
      diagnostics: revisions.diagnostics,
      checkedWith: revisions.checkedWith,
    })
    .from(revisions)
    .where(eq(revisions.id, revisionId))
    .limit(1);
  if (!row) return null;
  const typeChecked = row.diagnostics.length === 0 && row.checkedWith === typeCheckerName;
  return { source: row.source, typeChecked };
}

/**
 * Loads a trial's inputs: the revision's source (the candidate side; for a drift check, the
 * incumbent itself), the incumbent's source when the trial has one, whether each passed the
 * type check when submitted (then the trial does not repeat it), the routine's contract
 * and acceptance policy, and the trial's matrix set with its timing sizes. Throws
 * TrialCannotRun for inputs that a retry would not repair.
 */
export async function loadTrialInput(db: Db, trial: TrialRow): Promise<TrialEngineInput> {
  const [routine] = await db.select().from(routines).where(eq(routines.id, trial.routineId));
  if (!routine) throw new TrialCannotRun('its routine no longer exists');
  const candidate = await kernelOf(db, trial.revisionId);
  if (candidate === null) throw new TrialCannotRun('its revision no longer exists');
  const incumbent =
    trial.incumbentRevisionId === null ? null : await kernelOf(db, trial.incumbentRevisionId);
  const policy = acceptancePolicySchema.safeParse(routine.policy);
  if (!policy.success) {
    throw new TrialCannotRun(
      `the routine's acceptance policy is not valid (${policy.error.issues[0]?.message ?? 'unknown'})`,
    );
  }
  const [set] = await db.select().from(matrixSets).where(eq(matrixSets.id, trial.matrixSetId));
  if (!set) throw new TrialCannotRun('its matrix set no longer exists');
  const started = performance.now();
  const matrices = await buildSetMatrices(db, set.id);
  return {
    routine: routine.contract,
    candidateSource: candidate.source,
    incumbentSource: incumbent?.source ?? null,
    candidateTypeChecked: candidate.typeChecked,
    incumbentTypeChecked: incumbent?.typeChecked ?? false,
    setName: set.name,
    matrices,
    matricesMs: performance.now() - started,
    timingSizes: set.timingSizes,
    policy: policy.data,
  };
}
