import { useState } from 'react';
import type { Comment } from '@shared/api/comments.ts';
import { CommentForm } from './comment-form.tsx';
import { CommentList } from './comment-list.tsx';

interface LineCommentPanelProps {
  candidateId: number;
  revisionId: number;
  revisionNumber: number;
  source: string;
  comments: readonly Comment[];
  pickedLine: number | null;
  onPickLine: (line: number | null) => void;
}

/**
 * Beside the diff: the line comments of the shown revision by line, and the form for a new one.
 * A line is picked by a click in the diff's gutter, or typed here (keyboard users).
 */
export function LineCommentPanel({
  candidateId,
  revisionId,
  revisionNumber,
  source,
  comments,
  pickedLine,
  onPickLine,
}: LineCommentPanelProps) {
  const lines = source.split('\n');
  const [typedLine, setTypedLine] = useState('');
  const sorted = [...comments].sort((a, b) => (a.line ?? 0) - (b.line ?? 0) || a.id - b.id);
  const typed = Number(typedLine);
  const typedValid = Number.isInteger(typed) && typed >= 1 && typed <= lines.length;
  return (
    <aside aria-labelledby="line-comments-title" className="max-w-3xl space-y-4">
      <h3 id="line-comments-title" className="font-semibold">
        Line comments on revision {revisionNumber}
      </h3>
      {pickedLine !== null ? (
        <div className="rounded border border-near/60 bg-paper-deep p-3">
          <pre className="mb-2 overflow-hidden text-ellipsis whitespace-pre font-mono text-xs text-ink-soft">
            {pickedLine}: {lines[pickedLine - 1]?.trim() ?? ''}
          </pre>
          <CommentForm
            key={`${revisionId}-${pickedLine}`}
            candidateId={candidateId}
            target={{ revisionId, revisionNumber, line: pickedLine }}
            label={`Comment on line ${pickedLine}`}
            submitLabel="Comment on line"
            onDone={() => onPickLine(null)}
            autoFocus
          />
        </div>
      ) : (
        <form
          className="flex items-end gap-2"
          onSubmit={(e) => {
            e.preventDefault();
            if (typedValid) onPickLine(typed);
          }}
        >
          <label className="text-sm">
            <span className="block font-medium">Line</span>
            <input
              type="number"
              min={1}
              max={lines.length}
              value={typedLine}
              onChange={(e) => setTypedLine(e.target.value)}
              className="w-20 rounded border border-rule bg-white px-2 py-1 font-mono"
            />
          </label>
          <button
            type="submit"
            disabled={!typedValid}
            className="rounded border border-ink px-3 py-1 text-sm disabled:opacity-50"
          >
            Comment on this line
          </button>
        </form>
      )}
      <CommentList comments={sorted} empty="No line comments on this revision yet." />
    </aside>
  );
}
