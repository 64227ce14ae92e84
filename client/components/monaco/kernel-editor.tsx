import Editor, { type OnMount } from '@monaco-editor/react';
import { useEffect, useRef, useState } from 'react';
import type { KernelDiagnostic } from '@shared/contracts/kernel-diagnostic.ts';
import { editorOptions, monaco } from './monaco-setup.ts';

const kernelUri = 'file:///kernel.ts';
const contractUri = 'file:///contract.d.ts';
const harnessUri = 'file:///harness.ts';

/** A problem the editor found as the author typed. */
export interface EditorProblem {
  line: number;
  column: number;
  message: string;
}

/**
 * The assignment the evaluator's type check makes (sandbox/isolate/type-check.ts): the kernel's
 * export must have the contract's declared type.
 */
function harnessSource(exportName: string): string {
  return [
    "import * as kernel from './kernel';",
    "import type * as contract from './contract';",
    `export const check: typeof contract.${exportName} = kernel.${exportName};`,
  ].join('\n');
}

function exportLine(source: string, exportName: string): number {
  const lines = source.split('\n');
  const pattern = new RegExp(
    `export\\s+(?:declare\\s+)?(?:function|const|let|var)\\s+${exportName}\\b`,
  );
  const i = lines.findIndex((l) => pattern.test(l));
  return i < 0 ? 1 : i + 1;
}

/**
 * Monaco with the routine's contract as an extra lib, so type errors show as the author types,
 * including a kernel whose export does not match the contract's signature.
 */
export function KernelEditor({
  contractText,
  exportName,
  value,
  onChange,
  serverDiagnostics,
  onProblems,
  label,
}: {
  contractText: string;
  exportName: string;
  value: string;
  onChange: (value: string) => void;
  /** Diagnostics of the last submission, drawn as markers of their own. */
  serverDiagnostics?: readonly KernelDiagnostic[];
  onProblems?: (problems: EditorProblem[]) => void;
  label: string;
}) {
  const editorRef = useRef<monaco.editor.IStandaloneCodeEditor | null>(null);
  const [ready, setReady] = useState(false);
  const onProblemsRef = useRef(onProblems);
  useEffect(() => {
    onProblemsRef.current = onProblems;
  }, [onProblems]);

  useEffect(() => {
    const defaults = monaco.typescript.typescriptDefaults;
    const libs = [
      defaults.addExtraLib(contractText, contractUri),
      defaults.addExtraLib(harnessSource(exportName), harnessUri),
    ];
    return () => libs.forEach((l) => l.dispose());
  }, [contractText, exportName]);

  // The signature check lives in the harness, which has no editor; read its diagnostics from
  // the TypeScript worker and draw them on the kernel's export.
  useEffect(() => {
    if (!ready) return;
    const model = editorRef.current?.getModel();
    if (!model) return;
    let cancelled = false;
    let timer: ReturnType<typeof setTimeout> | undefined;
    const check = async () => {
      try {
        const getWorker = await monaco.typescript.getTypeScriptWorker();
        const worker = await getWorker(model.uri);
        const diagnostics = await worker.getSemanticDiagnostics(harnessUri);
        if (cancelled || model.isDisposed()) return;
        const line = exportLine(model.getValue(), exportName);
        monaco.editor.setModelMarkers(
          model,
          'contract',
          diagnostics.map((d) => ({
            severity: monaco.MarkerSeverity.Error,
            message: `\`${exportName}\` does not match the contract: ${flatten(d.messageText)}`,
            startLineNumber: line,
            startColumn: 1,
            endLineNumber: line,
            endColumn: model.getLineMaxColumn(line),
          })),
        );
      } catch {
        // The worker is starting or the model went away; the next change checks again.
      }
    };
    const schedule = () => {
      clearTimeout(timer);
      timer = setTimeout(() => void check(), 400);
    };
    schedule();
    const sub = model.onDidChangeContent(schedule);
    return () => {
      cancelled = true;
      clearTimeout(timer);
      sub.dispose();
    };
  }, [ready, exportName, contractText]);

  useEffect(() => {
    const model = editorRef.current?.getModel();
    if (!ready || !model) return;
    monaco.editor.setModelMarkers(
      model,
      'submission',
      (serverDiagnostics ?? [])
        .filter((d) => d.file === 'kernel')
        .map((d) => ({
          severity: monaco.MarkerSeverity.Error,
          message: `${d.message} (${d.code}, from the submission's check)`,
          startLineNumber: d.line,
          startColumn: d.column,
          endLineNumber: d.line,
          endColumn: Math.max(
            d.column + 1,
            model.getLineMaxColumn(Math.min(d.line, model.getLineCount())),
          ),
        })),
    );
  }, [ready, serverDiagnostics]);

  useEffect(() => {
    if (!ready) return;
    const sub = monaco.editor.onDidChangeMarkers((uris) => {
      const model = editorRef.current?.getModel();
      if (!model || !uris.some((u) => u.toString() === model.uri.toString())) return;
      const markers = monaco.editor
        .getModelMarkers({ resource: model.uri })
        .filter((m) => m.severity === monaco.MarkerSeverity.Error && m.owner !== 'submission');
      onProblemsRef.current?.(
        markers
          .map((m) => ({ line: m.startLineNumber, column: m.startColumn, message: m.message }))
          .sort((a, b) => a.line - b.line || a.column - b.column),
      );
    });
    return () => sub.dispose();
  }, [ready]);

  const onMount: OnMount = (editor) => {
    editorRef.current = editor;
    setReady(true);
  };

  return (
    <div
      className="h-[28rem] overflow-hidden rounded border border-rule bg-white"
      data-testid="kernel-editor"
    >
      <Editor
        path={kernelUri}
        language="typescript"
        value={value}
        onChange={(v) => onChange(v ?? '')}
        onMount={onMount}
        loading={<div className="p-4 text-ink-soft">Loading the editor…</div>}
        options={{ ...editorOptions, ariaLabel: label }}
      />
    </div>
  );
}

function flatten(text: string | { messageText: string; next?: unknown[] }): string {
  if (typeof text === 'string') return text;
  const next = (text.next ?? []) as (string | { messageText: string; next?: unknown[] })[];
  return [text.messageText, ...next.map(flatten)].join(' ');
}
