import ts from 'typescript';
import type { KernelDiagnostic } from '@shared/contracts/kernel-diagnostic.ts';

const contractSpecifiers = new Set(['./contract', './contract.d.ts', './contract.js']);

const message =
  "Kernels run alone in the sandbox and cannot import modules; only types may be imported, from './contract' " +
  "(write `import type { … } from './contract'`).";

function isTypeOnlyImport(node: ts.ImportDeclaration): boolean {
  const clause = node.importClause;
  if (!clause) return false;
  if (clause.isTypeOnly) return true;
  const bindings = clause.namedBindings;
  return (
    clause.name === undefined &&
    bindings !== undefined &&
    ts.isNamedImports(bindings) &&
    bindings.elements.every((e) => e.isTypeOnly)
  );
}

function isAllowed(statement: ts.Statement): boolean {
  if (ts.isImportEqualsDeclaration(statement)) {
    return !ts.isExternalModuleReference(statement.moduleReference);
  }
  const specifier = ts.isImportDeclaration(statement)
    ? statement.moduleSpecifier
    : ts.isExportDeclaration(statement)
      ? statement.moduleSpecifier
      : undefined;
  if (specifier === undefined) return true;
  const fromContract = ts.isStringLiteral(specifier) && contractSpecifiers.has(specifier.text);
  if (ts.isImportDeclaration(statement)) return fromContract && isTypeOnlyImport(statement);
  return fromContract && (statement as ts.ExportDeclaration).isTypeOnly;
}

/**
 * Diagnostics for top-level imports a kernel may not have: anything but a type-only import
 * from './contract'. esbuild would turn a value import into `require(...)`, which does not
 * exist in the isolate, so the kernel would only fail later, at load.
 */
export function kernelImportDiagnostics(sourceFile: ts.SourceFile): KernelDiagnostic[] {
  const found: KernelDiagnostic[] = [];
  for (const statement of sourceFile.statements) {
    if (isAllowed(statement)) continue;
    const at = sourceFile.getLineAndCharacterOfPosition(statement.getStart(sourceFile));
    found.push({
      line: at.line + 1,
      column: at.character + 1,
      code: 'kernel-import',
      message,
      file: 'kernel',
    });
  }
  return found;
}
