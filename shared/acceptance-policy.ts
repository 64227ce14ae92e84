import { z } from 'zod';

/**
 * A routine's acceptance policy: the thresholds a trial is judged by. Defaults: the factor-ratio
 * threshold 30 is LAPACK's test threshold (dtest.in); the others are product defaults.
 */
export const acceptancePolicySchema = z
  .object({
    /** Every matrix that must factor needs a factor ratio (or, for back substitution, a solve residual ratio) at most this. */
    maxFactorRatio: z.number().positive().max(1e6).default(30),
    /** Every matrix that must be rejected must make the kernel throw. */
    requireRejections: z.boolean().default(true),
    /** No accuracy metric may be worse than the incumbent's by more than this factor on any matrix. */
    maxAccuracyLossFactor: z.number().min(1).max(1e6).default(10),
    /** A timing size judged `slower` by more than this fraction fails (0.05 = 5 %). */
    allowedSlowdown: z.number().min(0).max(10).default(0.05),
    /** The practical margin below which a timing difference is never called faster or slower. */
    timingMargin: z.number().min(0).max(1).default(0.03),
    /** Sign-offs a candidate needs before it is cleared. */
    signOffsRequired: z.number().int().min(1).max(10).default(1),
  })
  .strict();

export type AcceptancePolicy = z.infer<typeof acceptancePolicySchema>;
export const defaultAcceptancePolicy: AcceptancePolicy = acceptancePolicySchema.parse({});

export const policyRuleIds = [
  'factor-accuracy',
  'rejections',
  'versus-incumbent',
  'timing',
] as const;
export type PolicyRuleId = (typeof policyRuleIds)[number];

export const ruleResultSchema = z.object({
  rule: z.enum(policyRuleIds),
  passed: z.boolean(),
  /** Plain words for a reviewer: what was checked and what was found. */
  reason: z.string(),
  /** Matrix ids or sizes that broke the rule. */
  offenders: z.array(z.string()),
});
export type RuleResult = z.infer<typeof ruleResultSchema>;
