import { useMutation } from '@tanstack/react-query';
import { useState } from 'react';
import { useDropzone } from 'react-dropzone';
import { toast } from 'sonner';
import { ApiError } from '@client/api/api-client.ts';
import { errorMessage } from '@client/features/review/error-message.ts';
import {
  matrixMarketProblemSchema,
  maxUploadBytes,
  type MatrixMarketSummary,
  type Upload,
} from '@shared/api/uploads.ts';
import { previewUpload, storeUpload } from './team-admin.queries.ts';

function problemText(error: unknown): string {
  if (error instanceof ApiError) {
    const problem = matrixMarketProblemSchema.safeParse(error.details);
    if (problem.success) return `line ${problem.data.line}: ${problem.data.reason}`;
  }
  return errorMessage(error);
}

/**
 * A Matrix Market file dropped or chosen here is read by the API first (size, entries, symmetry)
 * and stored only when the maintainer confirms.
 */
export function MatrixUpload({
  teamId,
  onStored,
  pending,
}: {
  teamId: number;
  onStored: (upload: Upload) => void;
  pending: boolean;
}) {
  const [file, setFile] = useState<File | null>(null);
  const [summary, setSummary] = useState<MatrixMarketSummary | null>(null);
  const preview = useMutation({
    mutationFn: (f: File) => previewUpload(teamId, f),
    onSuccess: (s) => setSummary(s),
    onError: (error) => {
      setSummary(null);
      toast.error(`The file was not read: ${problemText(error)}`);
    },
  });
  const store = useMutation({
    mutationFn: (f: File) => storeUpload(teamId, f),
    onSuccess: (upload) => {
      toast.success(`${upload.fileName} is stored`);
      setFile(null);
      setSummary(null);
      onStored(upload);
    },
    onError: (error) => toast.error(`The file was not stored: ${problemText(error)}`),
  });
  const dropzone = useDropzone({
    multiple: false,
    maxSize: maxUploadBytes,
    accept: { 'text/plain': ['.mtx'], 'application/octet-stream': ['.mtx'] },
    onDropAccepted: ([f]) => {
      if (!f) return;
      setFile(f);
      setSummary(null);
      preview.mutate(f);
    },
    onDropRejected: ([rejection]) =>
      toast.error(
        `That file cannot be used: ${rejection?.errors.map((e) => e.message).join('; ') ?? 'refused'}`,
      ),
  });
  return (
    <div className="space-y-3 text-sm">
      <div
        {...dropzone.getRootProps({
          className: `cursor-pointer rounded border-2 border-dashed p-4 text-center ${dropzone.isDragActive ? 'border-within bg-within/5' : 'border-rule'}`,
        })}
      >
        <input {...dropzone.getInputProps({ 'aria-label': 'Matrix Market file (.mtx)' })} />
        <p>
          Drop a Matrix Market file (<span className="font-mono">.mtx</span>, up to 8 MiB) here, or{' '}
          <span className="underline">choose one</span>.
        </p>
      </div>
      {preview.isPending ? <p role="status">Reading {file?.name}…</p> : null}
      {preview.isError ? (
        <p role="alert" className="text-beyond">
          ✕ {file?.name}: {problemText(preview.error)}
        </p>
      ) : null}
      {summary && file ? (
        <div className="rounded border border-rule bg-white/60 p-3" data-testid="upload-preview">
          <p className="font-medium">{summary.fileName}</p>
          <dl className="mt-1 grid grid-cols-[7rem_1fr] gap-x-3 font-mono">
            <dt className="font-sans text-ink-soft">Size</dt>
            <dd>
              {summary.rows} × {summary.cols}
            </dd>
            <dt className="font-sans text-ink-soft">Entries</dt>
            <dd>{summary.entries}</dd>
            <dt className="font-sans text-ink-soft">Symmetry</dt>
            <dd>{summary.symmetry}</dd>
            <dt className="font-sans text-ink-soft">Field, format</dt>
            <dd>
              {summary.field}, {summary.format}
            </dd>
          </dl>
          <button
            type="button"
            disabled={store.isPending || pending}
            onClick={() => store.mutate(file)}
            className="mt-3 rounded border border-ink bg-ink px-3 py-1.5 font-medium text-paper disabled:opacity-60"
          >
            Store it and add it to this set
          </button>
        </div>
      ) : null}
    </div>
  );
}
