import { lazy, Suspense, useState } from 'react';
import { useDropzone } from 'react-dropzone';
import { LoadingState } from '@client/components/loading-state.tsx';
import type { EditorProblem } from '@client/components/monaco/kernel-editor.tsx';
import type { KernelDiagnostic } from '@shared/contracts/kernel-diagnostic.ts';

const KernelEditor = lazy(() =>
  import('@client/components/monaco/kernel-editor.tsx').then((m) => ({ default: m.KernelEditor })),
);

/**
 * The kernel's source: typed in Monaco against the contract, started from the contract's
 * starter, or read from a dropped `.ts` file.
 */
export function KernelSourceField({
  value,
  onChange,
  contractText,
  exportName,
  starterSource,
  serverDiagnostics,
  error,
}: {
  value: string;
  onChange: (source: string) => void;
  contractText: string;
  exportName: string;
  starterSource: string;
  serverDiagnostics?: readonly KernelDiagnostic[];
  error?: string;
}) {
  const [problems, setProblems] = useState<EditorProblem[]>([]);
  const [fileNote, setFileNote] = useState<string | null>(null);
  const { getRootProps, getInputProps, isDragActive, open } = useDropzone({
    multiple: false,
    noClick: true,
    noKeyboard: true,
    onDrop: async (accepted) => {
      const file = accepted[0];
      if (!file) return;
      if (!file.name.endsWith('.ts')) {
        setFileNote(`${file.name} is not a .ts file; nothing was read.`);
        return;
      }
      onChange(await file.text());
      setFileNote(`Read ${file.name} (${file.size.toLocaleString('en')} bytes).`);
    },
  });

  return (
    <div>
      <div className="mb-2 flex flex-wrap items-center justify-between gap-2">
        <span id="kernel-source-label" className="font-medium">
          Kernel source
        </span>
        <div className="flex flex-wrap gap-2 text-sm">
          <button
            type="button"
            onClick={() => {
              onChange(starterSource);
              setFileNote('Started from the contract’s starter kernel.');
            }}
            className="rounded border border-ink/40 px-2.5 py-1 hover:bg-paper-deep"
          >
            Start from the contract’s starter
          </button>
          <button
            type="button"
            onClick={open}
            className="rounded border border-ink/40 px-2.5 py-1 hover:bg-paper-deep"
          >
            Open a .ts file…
          </button>
        </div>
      </div>
      <div
        {...getRootProps({
          className: `relative rounded ${isDragActive ? 'outline-2 outline-dashed outline-within' : ''}`,
        })}
      >
        <input {...getInputProps({ 'aria-label': 'Kernel source file (.ts)' })} />
        <Suspense fallback={<LoadingState label="Loading the editor…" />}>
          <KernelEditor
            label="Kernel source, TypeScript"
            contractText={contractText}
            exportName={exportName}
            value={value}
            onChange={onChange}
            serverDiagnostics={serverDiagnostics}
            onProblems={setProblems}
          />
        </Suspense>
        {isDragActive ? (
          <div className="pointer-events-none absolute inset-0 flex items-center justify-center bg-paper/80 font-medium">
            Drop the .ts file to use it as the source
          </div>
        ) : null}
      </div>
      <p className="mt-1 text-xs text-ink-soft">
        Drop a .ts file on the editor to replace its text. The editor checks the source against the
        contract as you type.
      </p>
      {fileNote ? (
        <p className="mt-1 text-sm" role="status">
          {fileNote}
        </p>
      ) : null}
      {error ? (
        <p className="mt-1 text-sm text-beyond" role="alert">
          <span aria-hidden="true">✕ </span>
          {error}
        </p>
      ) : null}
      <div className="mt-2 text-sm" aria-live="polite" data-testid="editor-problems">
        {problems.length === 0 ? (
          <p className="text-within">
            <span aria-hidden="true">✓ </span>No type errors against the contract.
          </p>
        ) : (
          <details open>
            <summary className="cursor-pointer text-beyond">
              <span aria-hidden="true">✕ </span>
              {problems.length} type error{problems.length === 1 ? '' : 's'} against the contract
            </summary>
            <ul className="mt-1 space-y-0.5 font-mono text-xs">
              {problems.slice(0, 20).map((p, i) => (
                <li key={i}>
                  line {p.line}:{p.column} — {p.message}
                </li>
              ))}
            </ul>
          </details>
        )}
      </div>
    </div>
  );
}
