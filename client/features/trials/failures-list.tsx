import type { MatrixReport } from '@shared/trial-report.ts';

/** Every matrix the candidate failed on, with the reasons and the kernel's own message. */
export function FailuresList({ matrices }: { matrices: readonly MatrixReport[] }) {
  const failed = matrices.filter((m) => !m.passed);
  if (failed.length === 0) {
    return (
      <p className="text-within" data-testid="failures">
        <span aria-hidden="true">✓ </span>No failures: the candidate passed on every matrix.
      </p>
    );
  }
  return (
    <ul className="space-y-3" data-testid="failures">
      {failed.map((m) => (
        <li key={m.id} className="rounded border border-beyond/30 px-4 py-2">
          <p className="font-mono text-sm">
            {m.id}{' '}
            <span className="text-ink-soft">
              ({m.family}, {m.m}×{m.n}, {m.candidate.status})
            </span>
          </p>
          {m.failures.length > 0 ? (
            <ul className="mt-1 list-disc pl-5 text-sm">
              {m.failures.map((f, i) => (
                <li key={i}>{f}</li>
              ))}
            </ul>
          ) : null}
          {m.candidate.message ? (
            <p className="mt-1 font-mono text-xs text-ink-soft">
              Kernel said: {m.candidate.message}
            </p>
          ) : null}
        </li>
      ))}
    </ul>
  );
}
