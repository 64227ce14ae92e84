import { dirname } from 'node:path';
import ts from 'typescript';

/**
 * Compiler options for checking a kernel: ES2022 only (no DOM, no Node types: the kernel runs in
 * a bare isolate), strict, one file at a time like esbuild (`isolatedModules`).
 */
export const kernelCompilerOptions: ts.CompilerOptions = {
  target: ts.ScriptTarget.ES2022,
  module: ts.ModuleKind.ESNext,
  moduleResolution: ts.ModuleResolutionKind.Bundler,
  lib: ['lib.es2022.d.ts'],
  types: [],
  strict: true,
  noImplicitReturns: true,
  isolatedModules: true,
  skipLibCheck: true,
  noEmit: true,
};

const libDirectory = dirname(ts.getDefaultLibFilePath(kernelCompilerOptions));

/**
 * Parsed lib files, shared by every check in this process: parsing them is most of the first
 * check's cost (stack.md §6: about 800 ms first, 30–80 ms later).
 */
const libSourceFiles = new Map<string, ts.SourceFile>();

function libSourceFile(fileName: string, target: ts.ScriptTarget): ts.SourceFile | undefined {
  const cached = libSourceFiles.get(fileName);
  if (cached) return cached;
  const text = ts.sys.readFile(fileName);
  if (text === undefined) return undefined;
  const sourceFile = ts.createSourceFile(fileName, text, target);
  libSourceFiles.set(fileName, sourceFile);
  return sourceFile;
}

const isLibFile = (fileName: string) => fileName.startsWith(libDirectory);

/**
 * A CompilerHost over in-memory files (absolute virtual paths such as `/kernel.ts`) plus the
 * TypeScript lib files read from the installed package. Nothing else on disk is visible, so a
 * kernel's import of any other module does not resolve.
 */
export function createInMemoryHost(files: ReadonlyMap<string, string>): ts.CompilerHost {
  return {
    getSourceFile(fileName, languageVersion) {
      const text = files.get(fileName);
      if (text !== undefined) return ts.createSourceFile(fileName, text, languageVersion, true);
      return isLibFile(fileName) ? libSourceFile(fileName, ts.ScriptTarget.ES2022) : undefined;
    },
    getDefaultLibFileName: (options) => ts.getDefaultLibFilePath(options),
    getDefaultLibLocation: () => libDirectory,
    writeFile: () => undefined,
    getCurrentDirectory: () => '/',
    getDirectories: () => [],
    fileExists: (fileName) =>
      files.has(fileName) || (isLibFile(fileName) && ts.sys.fileExists(fileName)),
    readFile: (fileName) =>
      files.get(fileName) ?? (isLibFile(fileName) ? ts.sys.readFile(fileName) : undefined),
    getCanonicalFileName: (fileName) => fileName,
    useCaseSensitiveFileNames: () => true,
    getNewLine: () => '\n',
  };
}
