import { transform, type Message, type TransformFailure } from 'esbuild';
import type { KernelDiagnostic } from '@shared/contracts/kernel-diagnostic.ts';
import { defaultKernelLimits, sourceSizeDiagnostic } from '@sandbox/isolate/limits.ts';

export type CompileOutcome =
  { ok: true; js: string; ms: number } | { ok: false; diagnostics: KernelDiagnostic[]; ms: number };

function toDiagnostic(m: Message): KernelDiagnostic {
  return {
    line: Math.max(1, m.location?.line ?? 1),
    column: (m.location?.column ?? 0) + 1,
    code: 'syntax',
    message: m.text,
    file: 'kernel',
  };
}

function isTransformFailure(e: unknown): e is TransformFailure {
  return e instanceof Error && Array.isArray((e as Partial<TransformFailure>).errors);
}

/**
 * Compiles a kernel's TypeScript to JavaScript with esbuild's `transform` (loader ts, CommonJS,
 * ES2022). Types are stripped, not checked (see type-check.ts). Syntax errors come back as
 * diagnostics with 1-based line and column; a source above `maxSourceBytes` is refused before
 * esbuild sees it. The CommonJS output assigns `module.exports`, which the isolate supplies.
 */
export async function compileKernel(
  source: string,
  options: { maxSourceBytes?: number } = {},
): Promise<CompileOutcome> {
  const start = performance.now();
  const tooLarge = sourceSizeDiagnostic(
    source,
    options.maxSourceBytes ?? defaultKernelLimits.maxSourceBytes,
  );
  if (tooLarge) return { ok: false, diagnostics: [tooLarge], ms: performance.now() - start };
  try {
    const out = await transform(source, {
      loader: 'ts',
      format: 'cjs',
      target: 'es2022',
      sourcefile: 'kernel.ts',
      logLevel: 'silent',
    });
    return { ok: true, js: out.code, ms: performance.now() - start };
  } catch (e) {
    if (!isTransformFailure(e)) throw e;
    return { ok: false, diagnostics: e.errors.map(toDiagnostic), ms: performance.now() - start };
  }
}
