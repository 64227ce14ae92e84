import type { PaginationQuery } from '@shared/api/pagination.ts';
import type { TrialDetail, TrialEvent, TrialPage } from '@shared/api/trials.ts';
import { stringifyWithNonFinite } from '@shared/json-numbers.ts';
import type { CurrentUser } from '@server/auth/current-user.ts';
import type { Db } from '@server/db/client.ts';
import { AppError } from '@server/http/errors.ts';
import { routineAccess } from '@server/candidates/candidate-access.ts';
import { revisionAccess } from '@server/revisions/revision-access.ts';
import { trialCsv } from './trial-csv.ts';
import { toMatrixReport, toTimingReport, toTrialSummary } from './trial-rows.ts';
import {
  findTrial,
  listTrialsOf,
  matrixResultsOf,
  timingResultsOf,
  type TrialWithCandidate,
} from './trials.repo.ts';

/** The trial, when the caller belongs to its routine's team; 404 otherwise. */
async function trialAccess(db: Db, user: CurrentUser, id: number): Promise<TrialWithCandidate> {
  const found = await findTrial(db, id);
  if (!found) throw new AppError('not-found', 'No such trial.');
  await routineAccess(db, user, found.trial.routineId, 'trial');
  return found;
}

/**
 * The served trial report as JSON text (non-finite numbers as strings). A finished trial never
 * changes (a new try would first make it unfinished, with a new attempt number), so its text is
 * kept in `cache` under its id, attempt and finishing time; the access check runs every time.
 */
export async function getTrialJson(
  db: Db,
  user: CurrentUser,
  id: number,
  cache: TrialJsonCache,
): Promise<string> {
  const found = await trialAccess(db, user, id);
  const { trial } = found;
  const key =
    trial.finishedAt && trial.status !== 'queued' && trial.status !== 'running'
      ? `${trial.id}:${trial.attempts}:${trial.finishedAt.toISOString()}`
      : null;
  const cached = key === null ? undefined : cache.get(key);
  if (cached !== undefined) return cached;
  const json = stringifyWithNonFinite(await trialDetailOf(db, found));
  if (key !== null) cache.set(key, json);
  return json;
}

/** Finished trials' report texts, the least recently used dropped beyond `capacity`. */
export class TrialJsonCache {
  readonly #entries = new Map<string, string>();
  constructor(readonly capacity = 256) {}

  get size(): number {
    return this.#entries.size;
  }

  get(key: string): string | undefined {
    const value = this.#entries.get(key);
    if (value !== undefined) {
      this.#entries.delete(key);
      this.#entries.set(key, value);
    }
    return value;
  }

  set(key: string, value: string): void {
    this.#entries.delete(key);
    this.#entries.set(key, value);
    while (this.#entries.size > this.capacity) {
      this.#entries.delete(this.#entries.keys().next().value!);
    }
  }
}

/** A trial with its machine, phases, verdict and full results (candidate next to incumbent). */
async function trialDetailOf(
  db: Db,
  { trial, candidateId }: TrialWithCandidate,
): Promise<TrialDetail> {
  const id = trial.id;
  const [matrices, timing] = await Promise.all([matrixResultsOf(db, id), timingResultsOf(db, id)]);
  return {
    ...toTrialSummary(trial, candidateId),
    attempts: trial.attempts,
    machine: trial.machine,
    phases: trial.phases,
    verdict: trial.verdict,
    matrices: matrices.map(toMatrixReport),
    timing: timing.map(toTimingReport),
  };
}

/** The per-matrix table as CSV, with a file name for the download. */
export async function exportTrialCsv(
  db: Db,
  user: CurrentUser,
  id: number,
): Promise<{ fileName: string; csv: string }> {
  await trialAccess(db, user, id);
  const rows = await matrixResultsOf(db, id);
  return { fileName: `trial-${id}.csv`, csv: trialCsv(rows.map(toMatrixReport)) };
}

function toEvent(found: TrialWithCandidate): TrialEvent {
  const { trial } = found;
  return {
    trialId: trial.id,
    status: trial.status,
    progress: trial.progress,
    passed: trial.passed,
    message: trial.message,
  };
}

/**
 * Checks access and reads the trial's status once, then returns a reader for the live stream's
 * polls (null when the trial is gone).
 */
export async function openTrialEvents(
  db: Db,
  user: CurrentUser,
  id: number,
): Promise<{ first: TrialEvent; next: () => Promise<TrialEvent | null> }> {
  const found = await trialAccess(db, user, id);
  return {
    first: toEvent(found),
    next: async () => {
      const again = await findTrial(db, id);
      return again ? toEvent(again) : null;
    },
  };
}

/** A page of a revision's trials, newest first. */
export async function listRevisionTrials(
  db: Db,
  user: CurrentUser,
  revisionId: number,
  page: PaginationQuery,
): Promise<TrialPage> {
  const { revision } = await revisionAccess(db, user, revisionId);
  const { rows, total } = await listTrialsOf(db, revisionId, page);
  return {
    items: rows.map((t) => toTrialSummary(t, revision.candidateId)),
    total,
    limit: page.limit,
    offset: page.offset,
  };
}
