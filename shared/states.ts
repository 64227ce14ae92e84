import { z } from 'zod';

/**
 * Candidate states (product.md): drafting → on trial → in review → cleared → promoted; or
 * returned (sent back), withdrawn, trial failed (the trial itself could not run).
 */
export const candidateStates = [
  'drafting',
  'on-trial',
  'in-review',
  'cleared',
  'promoted',
  'returned',
  'withdrawn',
  'trial-failed',
] as const;
export const candidateStateSchema = z.enum(candidateStates);
export type CandidateState = z.infer<typeof candidateStateSchema>;

export const candidateStateLabels: Record<CandidateState, string> = {
  drafting: 'drafting',
  'on-trial': 'on trial',
  'in-review': 'in review',
  cleared: 'cleared',
  promoted: 'promoted',
  returned: 'returned',
  withdrawn: 'withdrawn',
  'trial-failed': 'trial failed',
};

/** A trial's life: queued → running → completed, or trial-failed (could not run) / errored (harness fault). */
export const trialStatuses = ['queued', 'running', 'completed', 'trial-failed', 'errored'] as const;
export const trialStatusSchema = z.enum(trialStatuses);
export type TrialStatus = z.infer<typeof trialStatusSchema>;

/** Why a trial ran: a candidate's revision, or a scheduled re-run of the incumbent (drift check). */
export const trialPurposes = ['candidate', 'drift-check'] as const;
export const trialPurposeSchema = z.enum(trialPurposes);
export type TrialPurpose = z.infer<typeof trialPurposeSchema>;

export const reviewVerdicts = ['sign-off', 'send-back'] as const;
export const reviewVerdictSchema = z.enum(reviewVerdicts);
export type ReviewVerdict = z.infer<typeof reviewVerdictSchema>;

export const promotionKinds = ['promote', 'reinstate'] as const;
export type PromotionKind = (typeof promotionKinds)[number];

export const driftStatuses = ['steady', 'drifted', 'failed'] as const;
export type DriftStatus = (typeof driftStatuses)[number];
