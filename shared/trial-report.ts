import { z } from 'zod';
import { ruleResultSchema } from './acceptance-policy.ts';
import { kernelDiagnosticSchema } from './contracts/kernel-diagnostic.ts';
import {
  callStatusSchema,
  expectationSchema,
  routineSlugSchema,
  timingVerdictSchema,
} from './routines.ts';

/**
 * A measured value: any IEEE double, Infinity and NaN included (a metric of a kernel's garbage
 * is Infinity; a singular matrix has κ = Infinity). zod's number() refuses non-finite values.
 */
const measured = z.custom<number>((v) => typeof v === 'number', { message: 'expected a number' });

/** Metric values; names as numerics.md defines them. Absent = does not apply or not trustworthy. */
export const metricsSchema = z
  .object({
    factorRatio: measured,
    componentwiseBoundRatio: measured,
    growthFactor: measured,
    orthogonalityRatio: measured,
    solveResidualRatio: measured,
    normwiseBackwardError: measured,
    componentwiseBackwardError: measured,
    forwardError: measured,
    forwardErrorOverBound: measured,
  })
  .partial();

export const kernelOutcomeSchema = z.object({
  status: callStatusSchema,
  message: z.string().optional(),
  metrics: metricsSchema,
  ms: z.number(),
});
export type KernelOutcome = z.infer<typeof kernelOutcomeSchema>;

export const matrixReportSchema = z.object({
  id: z.string(),
  family: z.string(),
  m: z.number().int(),
  n: z.number().int(),
  /** κ₁(A): exact where the family has it, else the 1-norm estimate; null when not defined (rectangular). */
  condition: measured.nullable(),
  conditionKind: z.enum(['exact', 'estimate']).nullable(),
  expected: expectationSchema,
  /**
   * Growth factor of the algorithm the contract prescribes, run by the harness on this matrix;
   * the factor-ratio threshold is scaled by max(1, referenceGrowth).
   */
  referenceGrowth: measured.nullable(),
  /** False when the reference solution could not be trusted (κ·u ≳ 1): forward errors are then omitted. */
  referenceTrusted: z.boolean(),
  note: z.string(),
  candidate: kernelOutcomeSchema,
  incumbent: kernelOutcomeSchema.nullable(),
  passed: z.boolean(),
  /** Why the candidate failed on this matrix, in plain words; empty when it passed. */
  failures: z.array(z.string()),
});
export type MatrixReport = z.infer<typeof matrixReportSchema>;

const timingSideSchema = z.object({
  medianMs: z.number(),
  q1Ms: z.number(),
  q3Ms: z.number(),
  gflops: z.number(),
});

export const timingReportSchema = z.object({
  n: z.number().int(),
  rounds: z.number().int(),
  candidate: z.number().nullable(),
  incumbent: z.number().nullable(),
  candidateDetail: timingSideSchema.nullable(),
  incumbentDetail: timingSideSchema.nullable(),
  ratio: z.number().nullable(),
  ci95: z.tuple([z.number(), z.number()]).nullable(),
  pValue: z.number().nullable(),
  verdict: timingVerdictSchema.nullable(),
  flags: z.array(z.string()),
  message: z.string().optional(),
  /**
   * The timing design behind the verdict (absent in reports made before it): blocks, each with a
   * fresh isolate per kernel, their timed rounds, each block's ratio estimate, and the robust
   * spreads (≈ relative sd) of the block estimates and of single rounds within a block.
   */
  blocks: z.number().int().nonnegative().optional(),
  roundsPerBlock: z.array(z.number().int().nonnegative()).optional(),
  blockRatios: z.array(z.number()).optional(),
  betweenBlockSpread: z.number().nullable().optional(),
  roundSpread: z.number().nullable().optional(),
  /** Time inside kernel calls at this size, warm-up included (both kernels, every block). */
  callMs: z.number().nonnegative().optional(),
});
export type TimingReport = z.infer<typeof timingReportSchema>;

export const machineSchema = z.object({
  cpuModel: z.string(),
  cores: z.number().int(),
  totalMemoryBytes: z.number(),
  platform: z.string(),
  nodeVersion: z.string(),
  v8Version: z.string(),
  isolatedVmVersion: z.string(),
});
export type Machine = z.infer<typeof machineSchema>;

export const phaseTimesSchema = z.object({
  compileMs: z.number(),
  matricesMs: z.number(),
  kernelMs: z.number(),
  referenceMs: z.number(),
  metricsMs: z.number(),
  timingMs: z.number(),
  totalMs: z.number(),
});
export type PhaseTimes = z.infer<typeof phaseTimesSchema>;

export const trialReportSchema = z.object({
  routine: routineSlugSchema,
  /** `completed`, or `trial-failed` when the trial itself could not run (type error, nothing ran). */
  status: z.enum(['completed', 'trial-failed']),
  message: z.string().optional(),
  set: z.string(),
  machine: machineSchema,
  startedAt: z.string(),
  phases: phaseTimesSchema,
  diagnostics: z.object({
    candidate: z.array(kernelDiagnosticSchema),
    incumbent: z.array(kernelDiagnosticSchema),
  }),
  matrices: z.array(matrixReportSchema),
  timing: z.array(timingReportSchema),
  verdict: z.object({ passed: z.boolean(), rules: z.array(ruleResultSchema) }),
});
export type TrialReport = z.infer<typeof trialReportSchema>;
