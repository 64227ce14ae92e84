import ts from 'typescript';
import type { RoutineSlug } from '@shared/routines.ts';
import type { KernelDiagnostic } from '@shared/contracts/kernel-diagnostic.ts';
import { contractExports, contractTexts } from '@shared/contracts/contract-texts.ts';
import { kernelImportDiagnostics } from '@sandbox/isolate/kernel-imports.ts';
import { defaultKernelLimits, sourceSizeDiagnostic } from '@sandbox/isolate/limits.ts';
import { createInMemoryHost, kernelCompilerOptions } from '@sandbox/isolate/type-check-host.ts';
import { typeCheckerName } from '@sandbox/isolate/type-check-version.ts';

export interface TypeCheckOutcome {
  /** Errors only, sorted by position; empty when the kernel satisfies the contract. */
  diagnostics: KernelDiagnostic[];
  ms: number;
  /** The checker that ran (`TypeScript 5.9.3`), stored with the revision. */
  checkedWith: string;
}

const KERNEL = '/kernel.ts';
const CONTRACT = '/contract.d.ts';
const HARNESS = '/harness.ts';

/** The harness assigns the kernel's export to the contract's declared type, one line per export. */
function harnessSource(exportName: string): string {
  return [
    "import * as kernel from './kernel';",
    "import type * as contract from './contract';",
    `export const check: typeof contract.${exportName} = kernel.${exportName};`,
  ].join('\n');
}

/** Codes of "Cannot find name 'x'. Do you need …" whose advice does not apply to a kernel. */
const hostNameCodes = new Set([2580, 2582, 2584, 2591, 2867, 2868]);

/**
 * TypeScript prints module types as `typeof import("/kernel")` and typed arrays with their
 * buffer parameter; say it plainly, and replace advice about lib or Node types.
 */
function plain(text: string, code: number): string {
  const missing = /^Cannot find name '([^']+)'/.exec(text);
  if (missing && hostNameCodes.has(code)) {
    return (
      `Cannot find name '${missing[1]}': kernels run in a bare isolate with only the ES2022 ` +
      'built-ins (no console, timers, Node or browser APIs).'
    );
  }
  return text
    .replaceAll('typeof import("/kernel")', 'the kernel module')
    .replaceAll('import("/contract").', '')
    .replace(/<ArrayBuffer(Like)?>/g, '');
}

function declaredSignature(contract: string, exportName: string): string {
  const match = new RegExp(`export declare function (${exportName}\\([^;]*);`).exec(contract);
  return match ? match[1]! : exportName;
}

function at(file: ts.SourceFile, position: number): { line: number; column: number } {
  const lc = file.getLineAndCharacterOfPosition(position);
  return { line: lc.line + 1, column: lc.character + 1 };
}

/** Where the kernel declares `exportName`, or line 1, column 1 when it does not. */
function exportPosition(program: ts.Program, exportName: string): { line: number; column: number } {
  const file = program.getSourceFile(KERNEL)!;
  const checker = program.getTypeChecker();
  const moduleSymbol = checker.getSymbolAtLocation(file);
  const symbol = moduleSymbol
    ? checker.getExportsOfModule(moduleSymbol).find((s) => s.name === exportName)
    : undefined;
  const declaration = symbol?.declarations?.[0];
  if (!declaration || declaration.getSourceFile() !== file) return { line: 1, column: 1 };
  return at(file, (ts.getNameOfDeclaration(declaration) ?? declaration).getStart(file));
}

/** Turns a diagnostic in the harness into one about the kernel's own source. */
function fromHarness(
  d: ts.Diagnostic,
  program: ts.Program,
  exportName: string,
  contract: string,
): KernelDiagnostic {
  const code = `TS${d.code}`;
  const text = plain(ts.flattenDiagnosticMessageText(d.messageText, '\n'), d.code);
  const expected = declaredSignature(contract, exportName);
  if (d.code === 2306) {
    return {
      line: 1,
      column: 1,
      code,
      file: 'kernel',
      message: `The kernel must be a module that exports ${expected}.`,
    };
  }
  if (d.code === 2339 || d.code === 2305 || d.code === 2614) {
    return {
      line: 1,
      column: 1,
      code,
      file: 'kernel',
      message: `The kernel does not export \`${exportName}\`; the contract declares ${expected}.`,
    };
  }
  const position = exportPosition(program, exportName);
  return {
    ...position,
    code,
    file: 'kernel',
    message: `\`${exportName}\` does not match the contract (${expected}): ${text}`,
  };
}

function toDiagnostic(
  d: ts.Diagnostic,
  program: ts.Program,
  exportName: string,
  contract: string,
): KernelDiagnostic | null {
  const name = d.file?.fileName;
  if (name === HARNESS) return fromHarness(d, program, exportName, contract);
  if (name !== undefined && name !== KERNEL && name !== CONTRACT) return null;
  const position = d.file && d.start !== undefined ? at(d.file, d.start) : { line: 1, column: 1 };
  const message = plain(ts.flattenDiagnosticMessageText(d.messageText, '\n'), d.code);
  return {
    ...position,
    code: `TS${d.code}`,
    message,
    file: name === CONTRACT ? 'contract' : 'kernel',
  };
}

/**
 * Type-checks a kernel's source against its routine's contract, in memory, with the TypeScript
 * compiler API: `kernel.ts`, `contract.d.ts` and a harness that assigns the kernel's export to
 * the contract's declaration. Lib ES2022 only, strict. Errors in the harness are reported at
 * the kernel's declaration of the export (or line 1 when it is missing), with a plain message.
 * Imports other than types from './contract' are reported too (kernel-imports.ts).
 */
export function typeCheckKernel(
  source: string,
  routine: RoutineSlug,
  options: { maxSourceBytes?: number } = {},
): TypeCheckOutcome {
  const start = performance.now();
  const tooLarge = sourceSizeDiagnostic(
    source,
    options.maxSourceBytes ?? defaultKernelLimits.maxSourceBytes,
  );
  if (tooLarge) {
    return { diagnostics: [tooLarge], ms: performance.now() - start, checkedWith: typeCheckerName };
  }
  const exportName = contractExports[routine];
  const contract = contractTexts[routine];
  const files = new Map([
    [KERNEL, source],
    [CONTRACT, contract],
    [HARNESS, harnessSource(exportName)],
  ]);
  const program = ts.createProgram({
    rootNames: [HARNESS],
    options: kernelCompilerOptions,
    host: createInMemoryHost(files),
  });
  const diagnostics = ts
    .getPreEmitDiagnostics(program)
    .filter((d) => d.category === ts.DiagnosticCategory.Error)
    .map((d) => toDiagnostic(d, program, exportName, contract))
    .filter((d): d is KernelDiagnostic => d !== null);
  diagnostics.push(...kernelImportDiagnostics(program.getSourceFile(KERNEL)!));
  diagnostics.sort((a, b) => a.line - b.line || a.column - b.column);
  return { diagnostics, ms: performance.now() - start, checkedWith: typeCheckerName };
}
