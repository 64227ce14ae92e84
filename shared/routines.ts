import { z } from 'zod';

/** The six built-in routines (product.md, "Routines and their contracts"). */
export const routineSlugs = [
  'lu-partial-pivoting',
  'lu-no-pivoting',
  'cholesky',
  'ldlt',
  'householder-qr',
  'back-substitution',
] as const;

export const routineSlugSchema = z.enum(routineSlugs);
export type RoutineSlug = z.infer<typeof routineSlugSchema>;

export const routineTitles: Record<RoutineSlug, string> = {
  'lu-partial-pivoting': 'LU with partial pivoting',
  'lu-no-pivoting': 'LU without pivoting',
  cholesky: 'Cholesky',
  ldlt: 'LDLᵀ',
  'householder-qr': 'Householder QR',
  'back-substitution': 'Back substitution',
};

/** What a matrix asks of a kernel for one routine: factor it, or reject it by throwing. */
export const expectationSchema = z.enum(['factor', 'reject']);
export type Expectation = z.infer<typeof expectationSchema>;

/** How a single kernel call ended (never a crash of the caller). */
export const callStatuses = [
  'ok',
  'threw',
  'timeout',
  'out-of-memory',
  'invalid-output',
  'non-finite',
] as const;
export const callStatusSchema = z.enum(callStatuses);
export type CallStatus = z.infer<typeof callStatusSchema>;

export const timingVerdicts = ['faster', 'slower', 'no clear difference'] as const;
export const timingVerdictSchema = z.enum(timingVerdicts);
export type TimingVerdict = z.infer<typeof timingVerdictSchema>;
