import type { ReviewVerdict } from '@shared/states.ts';
import type { KernelRef } from './demo-kernels.ts';
import type { DemoRoutineKey } from './demo-routines.ts';

/** When an event happened: whole days before the load, at an hour of that day (UTC). */
export interface DemoMoment {
  day: number;
  hour: number;
}

/**
 * One thing a person of the demo team did. Candidates are named by a key of this story; people
 * by their login. `line` names a line of the candidate's latest revision by a piece of its text.
 */
export type DemoEvent = DemoMoment &
  (
    | {
        kind: 'submit';
        candidate: string;
        routine: DemoRoutineKey;
        by: string;
        title: string;
        description: string;
        kernel: KernelRef;
        /**
         * `run`: the engine runs the trial now. `run-until-passed`: as `run`, and when only the
         * timing rule failed (noise at these small sizes), the author submits the same source
         * again, up to twice. `queue`: the trial is left queued for the worker.
         */
        trial: 'run' | 'run-until-passed' | 'queue';
      }
    | {
        kind: 'revise';
        candidate: string;
        by: string;
        kernel: KernelRef;
        trial: 'run' | 'run-until-passed';
      }
    | {
        kind: 'draft';
        candidate: string;
        routine: DemoRoutineKey;
        by: string;
        title: string;
        description: string;
      }
    | { kind: 'comment'; candidate: string; by: string; body: string; line?: string }
    | { kind: 'review'; candidate: string; by: string; verdict: ReviewVerdict; body: string }
    | { kind: 'promote'; candidate: string; by: string; note: string }
    | { kind: 'reinstate'; routine: DemoRoutineKey; candidate: string; by: string; note: string }
    | { kind: 'withdraw'; candidate: string; by: string }
    | {
        kind: 'drift-check';
        routine: DemoRoutineKey;
        /**
         * `as-deployed`: the re-run runs as every trial does. `optimiser-off`: the re-run runs
         * with V8's optimising compiler switched off in this process, standing in for a runtime
         * upgrade that lost the optimisation of the kernel; the slowdown it measures is real.
         */
        runtime: 'as-deployed' | 'optimiser-off';
      }
  );

/** When the team, its members, the uploads, the matrix sets and the routines were set up. */
export const setupMoments = {
  team: { day: 150, hour: 9 },
  uploads: { day: 149, hour: 10 },
  routines: { day: 149, hour: 11 },
} satisfies Record<string, DemoMoment>;

/** The team's history, oldest first. */
export const demoStory: readonly DemoEvent[] = [
  // The first incumbents: the kernels the firm's solvers already shipped.
  {
    day: 140,
    hour: 10,
    kind: 'submit',
    candidate: 'lu-plain',
    routine: 'lu',
    by: 'tomas.lindqvist',
    title: 'Plain GEPP as shipped in the frame solver',
    description:
      'The LU the nonlinear frame solver has used for years, submitted so that it has a record here before anything replaces it.',
    kernel: { starter: 'lu-partial-pivoting' },
    trial: 'run-until-passed',
  },
  {
    day: 139,
    hour: 14,
    kind: 'comment',
    candidate: 'lu-plain',
    by: 'mateo.achterberg',
    body: 'Growth on the worst-growth matrix is what partial pivoting allows, and every factor ratio is far below 30. No surprises.',
  },
  {
    day: 139,
    hour: 15,
    kind: 'review',
    candidate: 'lu-plain',
    by: 'mateo.achterberg',
    verdict: 'sign-off',
    body: 'Accuracy as expected of GEPP on the whole set; the singular matrix is refused.',
  },
  {
    day: 138,
    hour: 9,
    kind: 'promote',
    candidate: 'lu-plain',
    by: 'ines.okafor',
    note: 'First incumbent: the kernel in production today, so later candidates have something to be measured against.',
  },

  {
    day: 135,
    hour: 11,
    kind: 'submit',
    candidate: 'bs-plain',
    routine: 'back-substitution',
    by: 'mateo.achterberg',
    title: 'Row-by-row back substitution',
    description: 'The triangular solve of the load-case loop, as shipped.',
    kernel: { starter: 'back-substitution' },
    trial: 'run-until-passed',
  },
  {
    day: 134,
    hour: 10,
    kind: 'review',
    candidate: 'bs-plain',
    by: 'tomas.lindqvist',
    verdict: 'sign-off',
    body: 'Componentwise backward error at the level of γ_n on every U; the zero diagonal is refused.',
  },
  {
    day: 133,
    hour: 16,
    kind: 'promote',
    candidate: 'bs-plain',
    by: 'ines.okafor',
    note: 'First incumbent of the triangular solve.',
  },

  {
    day: 130,
    hour: 9,
    kind: 'submit',
    candidate: 'chol-plain',
    routine: 'cholesky',
    by: 'tomas.lindqvist',
    title: 'Cholesky with a separate L',
    description:
      "The stiffness solver's Cholesky as shipped: builds L in a new array and leaves A alone.",
    kernel: { starter: 'cholesky' },
    trial: 'run-until-passed',
  },
  {
    day: 129,
    hour: 11,
    kind: 'review',
    candidate: 'chol-plain',
    by: 'mateo.achterberg',
    verdict: 'sign-off',
    body: 'All three tower frames factor with ratios near 1; the indefinite matrix is refused.',
  },
  {
    day: 129,
    hour: 15,
    kind: 'review',
    candidate: 'chol-plain',
    by: 'ines.okafor',
    verdict: 'sign-off',
    body: 'Second sign-off, as this routine requires. Agree with Mateo.',
  },
  {
    day: 128,
    hour: 10,
    kind: 'promote',
    candidate: 'chol-plain',
    by: 'ines.okafor',
    note: 'First incumbent of the stiffness solver.',
  },

  // Faster kernels replace them.
  {
    day: 80,
    hour: 10,
    kind: 'submit',
    candidate: 'lu-right-looking',
    routine: 'lu',
    by: 'priya.venkat',
    title: 'Right-looking GEPP with contiguous row updates',
    description:
      "Keeps the pivot row's offset and updates each row with unit stride. Same pivoting and tie rule as the incumbent.",
    kernel: { example: 'lu-partial-pivoting-right-looking' },
    trial: 'run-until-passed',
  },
  {
    day: 79,
    hour: 11,
    kind: 'comment',
    candidate: 'lu-right-looking',
    by: 'tomas.lindqvist',
    line: 'a[row + j] = a[row + j]! - l * a[pivotRow + j]!',
    body: 'This is the loop that matters: unit stride in j, and the pivot row read from one offset.',
  },
  {
    day: 79,
    hour: 16,
    kind: 'review',
    candidate: 'lu-right-looking',
    by: 'tomas.lindqvist',
    verdict: 'sign-off',
    body: 'Accuracy matches the incumbent matrix by matrix; timing no worse at either size.',
  },
  {
    day: 77,
    hour: 9,
    kind: 'promote',
    candidate: 'lu-right-looking',
    by: 'ines.okafor',
    note: 'Replaces the plain GEPP in the frame solver from its next release.',
  },

  {
    day: 60,
    hour: 10,
    kind: 'submit',
    candidate: 'chol-in-place',
    routine: 'cholesky',
    by: 'priya.venkat',
    title: 'In-place row-oriented Cholesky',
    description:
      'Overwrites the lower triangle of A with L, so the 3-D tower model no longer needs a second n×n array.',
    kernel: { example: 'cholesky-row-oriented' },
    trial: 'run-until-passed',
  },
  {
    day: 59,
    hour: 14,
    kind: 'review',
    candidate: 'chol-in-place',
    by: 'mateo.achterberg',
    verdict: 'sign-off',
    body: 'Same accuracy on the frame matrices; the upper triangle is left as it was, which the contract allows.',
  },
  {
    day: 58,
    hour: 10,
    kind: 'comment',
    candidate: 'chol-in-place',
    by: 'tomas.lindqvist',
    line: 'if (!(s > 0))',
    body: 'Good: the test is written so that a NaN pivot is refused too.',
  },
  {
    day: 58,
    hour: 11,
    kind: 'review',
    candidate: 'chol-in-place',
    by: 'tomas.lindqvist',
    verdict: 'sign-off',
    body: 'Second sign-off.',
  },
  {
    day: 57,
    hour: 9,
    kind: 'promote',
    candidate: 'chol-in-place',
    by: 'ines.okafor',
    note: 'In place: halves the memory of the stiffness solve on the large models.',
  },

  {
    day: 50,
    hour: 10,
    kind: 'submit',
    candidate: 'bs-row-offset',
    routine: 'back-substitution',
    by: 'priya.venkat',
    title: 'Back substitution with the row offset hoisted',
    description:
      'Same arithmetic in the same order as the incumbent; the row offset is computed once per row.',
    kernel: { example: 'back-substitution-row-oriented' },
    trial: 'run-until-passed',
  },
  {
    day: 49,
    hour: 15,
    kind: 'review',
    candidate: 'bs-row-offset',
    by: 'tomas.lindqvist',
    verdict: 'sign-off',
    body: 'Identical results to the incumbent, as expected from the same order of operations.',
  },
  {
    day: 48,
    hour: 9,
    kind: 'promote',
    candidate: 'bs-row-offset',
    by: 'ines.okafor',
    note: 'Small cleanup, promoted with the load-case loop rewrite.',
  },

  // Candidates that did not make it, or not yet.
  {
    day: 30,
    hour: 10,
    kind: 'submit',
    candidate: 'lu-single',
    routine: 'lu',
    by: 'yara.domsch',
    title: 'Mixed-precision updates for the tangent matrix',
    description:
      'Rounds the multipliers and the rank-one updates to single precision, hoping for speed on large models.',
    kernel: { example: 'lu-single-precision-updates' },
    trial: 'run',
  },
  {
    day: 29,
    hour: 11,
    kind: 'comment',
    candidate: 'lu-single',
    by: 'tomas.lindqvist',
    line: 'Math.fround(a[row + j]! - Math.fround(',
    body: 'Every update is rounded to binary32 here, so the factors carry single-precision errors whatever the input.',
  },
  {
    day: 29,
    hour: 12,
    kind: 'review',
    candidate: 'lu-single',
    by: 'tomas.lindqvist',
    verdict: 'send-back',
    body: 'The factor ratio is far above 30 on the random matrices: the residual of the factors is at single-precision level. If speed is the goal, keep the updates in double and look at the loop order instead.',
  },

  {
    day: 25,
    hour: 16,
    kind: 'reinstate',
    routine: 'back-substitution',
    candidate: 'bs-plain',
    by: 'ines.okafor',
    note: "Back to the row-by-row kernel while the tower project's calculation package is certified: the package names that revision. Both measure the same.",
  },

  {
    day: 20,
    hour: 10,
    kind: 'submit',
    candidate: 'lu-identity-perm',
    routine: 'lu',
    by: 'priya.venkat',
    title: 'GEPP without separate permutation bookkeeping',
    description: 'Swaps rows in place and drops the extra array.',
    kernel: { example: 'lu-pivots-identity-perm' },
    trial: 'run',
  },
  {
    day: 19,
    hour: 9,
    kind: 'comment',
    candidate: 'lu-identity-perm',
    by: 'priya.venkat',
    body: 'The trial is right: the rows are exchanged but perm stays the identity, so PA = LU fails on every matrix that pivots. Withdrawing; the bookkeeping is needed.',
  },
  { day: 19, hour: 9, kind: 'withdraw', candidate: 'lu-identity-perm', by: 'priya.venkat' },

  {
    day: 14,
    hour: 10,
    kind: 'submit',
    candidate: 'chol-abs-pivot',
    routine: 'cholesky',
    by: 'yara.domsch',
    title: 'Cholesky tolerant of round-off negative pivots',
    description:
      'Takes the square root of |pivot| so that nearly singular stiffness matrices of unrestrained models still factor.',
    kernel: { example: 'cholesky-no-definiteness-check' },
    trial: 'run',
  },
  {
    day: 13,
    hour: 11,
    kind: 'review',
    candidate: 'chol-abs-pivot',
    by: 'mateo.achterberg',
    verdict: 'send-back',
    body: 'The indefinite matrix now gets a factor instead of an error. For us a negative pivot means a mechanism in the model, and the analysis must stop there, not carry on with a made-up factor.',
  },

  {
    day: 12,
    hour: 10,
    kind: 'submit',
    candidate: 'bs-two-sums',
    routine: 'back-substitution',
    by: 'yara.domsch',
    title: 'Back substitution with two partial sums',
    description: "Splits each row's dot product into two sums to shorten the dependency chain.",
    kernel: { inline: 'back-substitution-two-sums-unchecked' },
    trial: 'run',
  },
  {
    day: 11,
    hour: 14,
    kind: 'review',
    candidate: 'bs-two-sums',
    by: 'tomas.lindqvist',
    verdict: 'send-back',
    body: 'The zero diagonal of the singular U is divided through instead of refused. Put the check back.',
  },
  {
    day: 10,
    hour: 9,
    kind: 'revise',
    candidate: 'bs-two-sums',
    by: 'yara.domsch',
    kernel: { inline: 'back-substitution-two-sums' },
    trial: 'run-until-passed',
  },
  {
    day: 9,
    hour: 11,
    kind: 'comment',
    candidate: 'bs-two-sums',
    by: 'tomas.lindqvist',
    line: 'if (diagonal === 0)',
    body: 'Checked before the sums now, so no work is wasted on a row that will be refused.',
  },
  {
    day: 9,
    hour: 11,
    kind: 'review',
    candidate: 'bs-two-sums',
    by: 'tomas.lindqvist',
    verdict: 'sign-off',
    body: 'Revision 2 refuses the singular U, and its errors match the incumbent.',
  },

  { day: 7, hour: 3, kind: 'drift-check', routine: 'cholesky', runtime: 'as-deployed' },

  {
    day: 6,
    hour: 10,
    kind: 'submit',
    candidate: 'lu-blocked',
    routine: 'lu',
    by: 'yara.domsch',
    title: 'Column-blocked LU, first sketch',
    description: 'Blocks of eight columns, to be followed by a blocked update.',
    kernel: { inline: 'lu-blocked-without-permutation' },
    trial: 'run',
  },
  {
    day: 5,
    hour: 9,
    kind: 'comment',
    candidate: 'lu-blocked',
    by: 'yara.domsch',
    body: 'The type check is right: this sketch has no pivoting and no perm yet. Parking it until the loop-order experiment is done.',
  },

  {
    day: 3,
    hour: 10,
    kind: 'submit',
    candidate: 'lu-column-sweep',
    routine: 'lu',
    by: 'yara.domsch',
    title: 'Column-sweep update, Fortran loop order',
    description: 'The update loop ported from the old Fortran solver: column by column.',
    kernel: { example: 'lu-column-stride' },
    trial: 'run',
  },
  { day: 2, hour: 3, kind: 'drift-check', routine: 'lu', runtime: 'optimiser-off' },
  {
    day: 2,
    hour: 10,
    kind: 'comment',
    candidate: 'lu-column-sweep',
    by: 'mateo.achterberg',
    line: 'for (let i = k + 1; i < n; i++) a[i * n + j]',
    body: 'In row-major storage this walks down a column with stride n. Fine for Fortran, costly here once n grows; the timing sizes in our set are too small to show it well.',
  },
  {
    day: 2,
    hour: 11,
    kind: 'comment',
    candidate: 'lu-column-sweep',
    by: 'priya.venkat',
    body: 'Accuracy is identical to the incumbent, so this is purely a speed question. Could we add a timing size of 256 to the set before deciding?',
  },

  {
    day: 1,
    hour: 16,
    kind: 'draft',
    candidate: 'bs-blocked',
    routine: 'back-substitution',
    by: 'priya.venkat',
    title: 'Blocked back substitution for many load cases',
    description: 'Idea: solve for all load cases of a storey at once. No source yet.',
  },

  {
    day: 1,
    hour: 17,
    kind: 'submit',
    candidate: 'lu-hoisted',
    routine: 'lu',
    by: 'priya.venkat',
    title: 'Right-looking GEPP with hoisted row offsets',
    description:
      'The incumbent with every row offset computed once per row and the pivot magnitude kept.',
    kernel: { inline: 'lu-hoisted-row-offsets' },
    trial: 'queue',
  },
];
