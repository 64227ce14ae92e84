import type { CallStatus, RoutineSlug } from '@shared/routines.ts';
import type { KernelDiagnostic } from '@shared/contracts/kernel-diagnostic.ts';
import { routineSignatures } from '@sandbox/contracts/routine-signatures.ts';
import { compileKernel } from '@sandbox/isolate/compile.ts';
import { createKernelInstance, type KernelInstance } from '@sandbox/isolate/kernel-instance.ts';
import { startKernelSession } from '@sandbox/isolate/kernel-isolate.ts';
import { resolveLimits, type KernelLimits } from '@sandbox/isolate/limits.ts';
import { typeCheckKernel } from '@sandbox/isolate/type-check.ts';

export type LoadOutcome<R extends RoutineSlug> =
  | {
      ok: true;
      kernel: KernelInstance<R>;
      /** esbuild plus the type check (nothing for it when `typeCheck` is `skip`). */
      compileMs: number;
      /** Starting the isolate and running the module's top level. */
      loadMs: number;
      /** Type errors, when `typeCheck` is `warn`; otherwise empty. */
      diagnostics: KernelDiagnostic[];
    }
  | {
      ok: false;
      stage: 'compile' | 'type-check' | 'load';
      diagnostics: KernelDiagnostic[];
      message: string;
      /** For stage `load`: how the module's top level ended. */
      status?: CallStatus;
    };

export interface LoadOptions<R extends RoutineSlug> {
  source: string;
  routine: R;
  limits?: Partial<KernelLimits>;
  /**
   * `block` (default): type errors against the contract stop the load, as a trial with a type
   * error fails (product.md). `warn`: load anyway and return them. `skip`: do not check (a
   * revision checked when it was submitted).
   */
  typeCheck?: 'block' | 'warn' | 'skip';
}

/**
 * Compiles (esbuild), type-checks (against the routine's contract) and loads a kernel into a
 * fresh isolate with memory and time limits (kernel-isolate.ts). The instance's calls turn
 * every failure of the kernel into a status (kernel-instance.ts). Throws only for bad options.
 */
export async function loadKernel<R extends RoutineSlug>(
  options: LoadOptions<R>,
): Promise<LoadOutcome<R>> {
  const { source, routine } = options;
  const limits = resolveLimits(options.limits);
  const compiled = await compileKernel(source, limits);
  if (!compiled.ok) {
    const message = 'The kernel does not compile.';
    return { ok: false, stage: 'compile', diagnostics: compiled.diagnostics, message };
  }
  const mode = options.typeCheck ?? 'block';
  const checked =
    mode === 'skip' ? { diagnostics: [], ms: 0 } : typeCheckKernel(source, routine, limits);
  if (mode === 'block' && checked.diagnostics.length > 0) {
    const count = checked.diagnostics.length;
    const message = `The kernel does not satisfy the ${routine} contract: ${count} type error(s).`;
    return { ok: false, stage: 'type-check', diagnostics: checked.diagnostics, message };
  }
  const loadStart = performance.now();
  const exportName = routineSignatures[routine].exportName;
  const started = await startKernelSession(compiled.js, exportName, limits);
  if (!started.ok) {
    const { message, status } = started;
    return { ok: false, stage: 'load', diagnostics: checked.diagnostics, message, status };
  }
  return {
    ok: true,
    kernel: createKernelInstance(routine, compiled.js, limits, started.session),
    compileMs: compiled.ms + checked.ms,
    loadMs: performance.now() - loadStart,
    diagnostics: checked.diagnostics,
  };
}
