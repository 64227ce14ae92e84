import type { CandidateState } from '@shared/states.ts';
import { AppError } from '../http/errors.ts';

/**
 * The candidate life cycle (product.md): drafting → on trial → in review → cleared → promoted;
 * returned after a send-back (a new revision puts it on trial again); withdrawn by its author;
 * trial failed when the trial itself could not run (a new revision puts it on trial again).
 * A promoted revision can later be replaced; the candidate stays promoted as a record.
 */
const allowed: Record<CandidateState, readonly CandidateState[]> = {
  drafting: ['on-trial', 'withdrawn'],
  'on-trial': ['in-review', 'trial-failed', 'withdrawn', 'on-trial'],
  'in-review': ['cleared', 'returned', 'on-trial', 'withdrawn'],
  cleared: ['promoted', 'returned', 'on-trial', 'withdrawn'],
  promoted: [],
  returned: ['on-trial', 'withdrawn'],
  withdrawn: [],
  'trial-failed': ['on-trial', 'withdrawn'],
};

export function canMove(from: CandidateState, to: CandidateState): boolean {
  return allowed[from].includes(to);
}

/** Throws 409 `conflict` with a plain message when the move is not part of the life cycle. */
export function assertMove(from: CandidateState, to: CandidateState): void {
  if (!canMove(from, to)) {
    throw new AppError(
      'conflict',
      `A candidate that is ${from.replace('-', ' ')} cannot become ${to.replace('-', ' ')}.`,
    );
  }
}
