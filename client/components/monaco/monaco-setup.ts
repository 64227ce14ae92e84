import { loader } from '@monaco-editor/react';
import * as monaco from 'monaco-editor';
import EditorWorker from 'monaco-editor/editor/editor.worker?worker';
import TsWorker from 'monaco-editor/languages/features/typescript/ts.worker?worker';

/**
 * Monaco from the local package, never a CDN (stack.md §2): the React wrapper is pointed at
 * our bundled copy, and the workers are built by Vite (monaco-editor 0.57's paths).
 */
self.MonacoEnvironment = {
  getWorker: (_id: string, label: string) =>
    label === 'typescript' || label === 'javascript' ? new TsWorker() : new EditorWorker(),
};
loader.config({ monaco });

/**
 * Kernels are checked like the evaluator checks them: strict ES2022 modules with no DOM or
 * Node types (sandbox/isolate/type-check-host.ts).
 */
monaco.typescript.typescriptDefaults.setCompilerOptions({
  target: monaco.typescript.ScriptTarget.ESNext,
  module: monaco.typescript.ModuleKind.ESNext,
  moduleResolution: monaco.typescript.ModuleResolutionKind.NodeJs,
  lib: ['es2022'],
  types: [],
  strict: true,
  noImplicitReturns: true,
  isolatedModules: true,
  noEmit: true,
  allowNonTsExtensions: true,
});
monaco.typescript.typescriptDefaults.setDiagnosticsOptions({
  noSemanticValidation: false,
  noSyntaxValidation: false,
});

export { monaco };

/** Editor options shared by the kernel editor and the diff view: our mono face, calm chrome. */
export const editorOptions: monaco.editor.IStandaloneEditorConstructionOptions = {
  fontFamily: "'IBM Plex Mono', ui-monospace, monospace",
  fontSize: 13,
  minimap: { enabled: false },
  scrollBeyondLastLine: false,
  tabSize: 2,
  automaticLayout: true,
  renderLineHighlight: 'line',
};
