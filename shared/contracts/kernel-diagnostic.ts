import { z } from 'zod';

/**
 * One problem found in a kernel's source before it runs: a syntax error, a type error against
 * the contract, or a refusal (source too large, a forbidden import). Line and column are
 * 1-based positions in the kernel's own source, so the editor can underline them.
 */
export const kernelDiagnosticSchema = z.object({
  line: z.number().int().min(1),
  column: z.number().int().min(1),
  /**
   * `TS2322` for TypeScript's codes; `syntax`, `source-too-large`, `kernel-import` or
   * `type-check-cut-off` (the check ran past its time or memory limit) otherwise.
   */
  code: z.string(),
  message: z.string(),
  /** Where the problem is: the kernel's source, or the contract it is checked against. */
  file: z.enum(['kernel', 'contract']),
});
export type KernelDiagnostic = z.infer<typeof kernelDiagnosticSchema>;
