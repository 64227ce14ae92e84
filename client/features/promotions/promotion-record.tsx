import { Link } from 'react-router-dom';
import { paths } from '@client/app/paths.ts';
import {
  formatDateTime,
  formatGflops,
  formatMs,
  formatRatio,
} from '@client/components/number-format.ts';
import type { Promotion } from '@shared/api/promotions.ts';

/** One promotion as the record keeps it: who, when, which trial, and the metrics snapshot. */
export function PromotionRecord({
  promotion,
  teamSlug,
}: {
  promotion: Promotion;
  teamSlug: string;
}) {
  const m = promotion.metricsSnapshot;
  return (
    <dl className="grid grid-cols-[10rem_1fr] gap-x-4 gap-y-1 text-sm">
      <dt className="text-ink-soft">What</dt>
      <dd>
        {promotion.kind === 'promote' ? 'Promoted' : 'Reinstated'}{' '}
        <Link to={paths.candidate(teamSlug, promotion.candidateId)} className="underline">
          {promotion.candidateTitle}
        </Link>{' '}
        revision {promotion.revisionNumber}
      </dd>
      <dt className="text-ink-soft">By</dt>
      <dd>{promotion.promotedBy.name ?? promotion.promotedBy.login}</dd>
      <dt className="text-ink-soft">When</dt>
      <dd>{formatDateTime(promotion.createdAt)}</dd>
      <dt className="text-ink-soft">Evidence</dt>
      <dd>
        <Link to={paths.trial(teamSlug, promotion.trialId)} className="underline">
          trial #{promotion.trialId}
        </Link>
      </dd>
      <dt className="text-ink-soft">Worst factor ratio</dt>
      <dd className="figures font-mono">{formatRatio(m.worstFactorRatio)}</dd>
      <dt className="text-ink-soft">Worst forward error / bound</dt>
      <dd className="figures font-mono">{formatRatio(m.worstForwardErrorOverBound)}</dd>
      <dt className="text-ink-soft">Timing</dt>
      <dd className="figures font-mono">
        {m.timing.length === 0
          ? '—'
          : m.timing
              .map((t) => `n=${t.n}: ${formatMs(t.medianMs)}, ${formatGflops(t.gflops)}`)
              .join(' · ')}
      </dd>
      {promotion.note ? (
        <>
          <dt className="text-ink-soft">Note</dt>
          <dd className="whitespace-pre-line">{promotion.note}</dd>
        </>
      ) : null}
    </dl>
  );
}
