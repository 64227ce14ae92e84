import { useQueries, useQuery } from '@tanstack/react-query';
import { useEffect, useRef, useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import { paths } from '@client/app/paths.ts';
import { EmptyState } from '@client/components/empty-state.tsx';
import { ErrorState } from '@client/components/error-state.tsx';
import { LoadingState } from '@client/components/loading-state.tsx';
import { formatDateTime, formatMs, formatRatio } from '@client/components/number-format.ts';
import { PageHeader } from '@client/components/page-header.tsx';
import { SignalBadge } from '@client/components/signal-badge.tsx';
import { promotionQueries } from '@client/features/promotions/promotions.queries.ts';
import { Section } from '@client/features/review/section.tsx';
import { useCurrentTeam } from '@client/features/teams/use-current-team.ts';
import { trialQueries } from '@client/features/trials/trials.queries.ts';
import type { DriftCheck, Logbook } from '@shared/api/logbook.ts';
import type { TrialDetail } from '@shared/api/trials.ts';
import { routineTitles } from '@shared/routines.ts';
import { LogbookCharts } from './logbook-charts.tsx';
import { logbookPoints } from './logbook-points.ts';

/** A routine's logbook: its incumbents' metrics over time, promotions, drift checks and alerts. */
export default function RoutineLogbookPage() {
  const { routineId: rawId = '' } = useParams();
  const routineId = Number(rawId);
  const { teamSlug } = useCurrentTeam();
  const logbook = useQuery({
    ...promotionQueries.logbook(routineId),
    enabled: Number.isInteger(routineId) && routineId > 0,
  });
  if (!Number.isInteger(routineId) || routineId <= 0) {
    return <ErrorState error={new Error(`“${rawId}” is not a routine number.`)} />;
  }
  if (logbook.isPending) return <LoadingState label="Loading the logbook…" />;
  if (logbook.isError) {
    return <ErrorState error={logbook.error} onRetry={() => void logbook.refetch()} />;
  }
  return <LogbookView logbook={logbook.data} teamSlug={teamSlug} />;
}

function useWidth() {
  const ref = useRef<HTMLDivElement>(null);
  const [width, setWidth] = useState(900);
  useEffect(() => {
    const el = ref.current;
    if (!el) return;
    const observer = new ResizeObserver(([entry]) => {
      if (entry) setWidth(Math.max(480, Math.floor(entry.contentRect.width) - 24));
    });
    observer.observe(el);
    return () => observer.disconnect();
  }, []);
  return { ref, width };
}

function byTrialId(results: { data?: TrialDetail | undefined }[]): Map<number, TrialDetail> {
  return new Map(
    results
      .map((r) => r.data)
      .filter((t): t is TrialDetail => t !== undefined)
      .map((t) => [t.id, t]),
  );
}

function LogbookView({ logbook, teamSlug }: { logbook: Logbook; teamSlug: string }) {
  const { routine } = logbook;
  const driftTrialIds = logbook.driftChecks
    .map((c) => c.trialId)
    .filter((id): id is number => id !== null)
    .slice(-30);
  const driftTrials = useQueries({
    queries: driftTrialIds.map((id) => trialQueries.detail(id)),
    combine: byTrialId,
  });
  const points = logbookPoints(logbook, driftTrials);
  const { ref, width } = useWidth();
  const sizes = [...new Set(points.flatMap((p) => p.timing.map((t) => t.n)))].sort((a, b) => a - b);
  const openAlerts = logbook.driftChecks.filter((c) => c.alertOpen);

  return (
    <div ref={ref}>
      <PageHeader
        eyebrow={
          <Link to={paths.routine(teamSlug, routine.id)} className="underline">
            {routine.title}
          </Link>
        }
        title="Logbook"
        description={`${routineTitles[routine.contract]}: every incumbent's figures over its tenure, promotions, and scheduled re-runs (drift checks).`}
        actions={
          <Link to={paths.promotions(teamSlug, routine.id)} className="text-sm underline">
            Promote or reinstate
          </Link>
        }
      />
      {openAlerts.length > 0 ? (
        <div role="alert" className="mb-6 rounded border border-beyond/50 bg-beyond/5 p-4">
          <p className="font-medium text-beyond">
            ✕ {openAlerts.length} open drift {openAlerts.length === 1 ? 'alert' : 'alerts'}
          </p>
          <ul className="mt-1 text-sm">
            {openAlerts.map((c) => (
              <li key={c.id}>
                {formatDateTime(c.finishedAt ?? c.createdAt)}: {c.summary ?? c.findings.join('; ')}
              </li>
            ))}
          </ul>
        </div>
      ) : null}

      {points.length === 0 ? (
        <EmptyState title="Nothing in this logbook yet.">
          The logbook starts when a maintainer promotes the routine&apos;s first kernel.
        </EmptyState>
      ) : (
        <>
          <LogbookCharts
            points={points}
            driftChecks={logbook.driftChecks}
            teamSlug={teamSlug}
            width={width}
          />
          <Section title="Points" id="points">
            <div className="overflow-x-auto">
              <table className="w-full text-sm" data-testid="logbook-points">
                <thead className="border-b border-rule text-left text-ink-soft">
                  <tr>
                    <th className="py-1 pr-4 font-medium">When</th>
                    <th className="py-1 pr-4 font-medium">What</th>
                    <th className="py-1 pr-4 text-right font-medium">Worst factor ratio</th>
                    {sizes.map((n) => (
                      <th key={n} className="py-1 pr-4 text-right font-medium">
                        median n = {n}
                      </th>
                    ))}
                    <th className="py-1 font-medium">Trial</th>
                  </tr>
                </thead>
                <tbody>
                  {[...points].reverse().map((p, i) => (
                    <tr key={`${p.source}-${p.trialId}-${i}`} className="border-b border-rule/60">
                      <td className="py-1 pr-4 whitespace-nowrap">
                        {formatDateTime(p.at.toISOString())}
                      </td>
                      <td className="py-1 pr-4">{p.label}</td>
                      <td className="py-1 pr-4 text-right font-mono">
                        {formatRatio(p.worstFactorRatio)}
                      </td>
                      {sizes.map((n) => (
                        <td key={n} className="py-1 pr-4 text-right font-mono">
                          {formatMs(p.timing.find((t) => t.n === n)?.medianMs)}
                        </td>
                      ))}
                      <td className="py-1">
                        <Link to={paths.trial(teamSlug, p.trialId)} className="underline">
                          #{p.trialId}
                        </Link>
                      </td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
          </Section>
        </>
      )}

      <Section title="Tenures" id="tenures">
        {logbook.tenures.length === 0 ? (
          <p className="text-sm text-ink-soft">No incumbent yet.</p>
        ) : (
          <ol className="space-y-1 text-sm">
            {[...logbook.tenures].reverse().map((t) => (
              <li key={t.promotionId}>
                <Link to={paths.candidate(teamSlug, t.candidateId)} className="underline">
                  {t.candidateTitle}
                </Link>{' '}
                r{t.revisionNumber}: {formatDateTime(t.from)} →{' '}
                {t.to ? formatDateTime(t.to) : <span className="font-medium">incumbent now</span>}
              </li>
            ))}
          </ol>
        )}
      </Section>

      <Section title="Drift checks" id="drift-checks">
        <DriftCheckList checks={logbook.driftChecks} teamSlug={teamSlug} />
      </Section>
    </div>
  );
}

function DriftStatus({ check }: { check: DriftCheck }) {
  if (check.status === null) return <SignalBadge signal="near">running</SignalBadge>;
  if (check.status === 'steady') return <SignalBadge signal="within">steady</SignalBadge>;
  if (check.status === 'drifted') return <SignalBadge signal="beyond">drifted</SignalBadge>;
  return <SignalBadge signal="beyond">failed</SignalBadge>;
}

function DriftCheckList({ checks, teamSlug }: { checks: readonly DriftCheck[]; teamSlug: string }) {
  if (checks.length === 0) {
    return <p className="text-sm text-ink-soft">No drift check has run for this routine yet.</p>;
  }
  return (
    <ol className="space-y-2">
      {[...checks].reverse().map((c) => (
        <li key={c.id} className="rounded border border-rule p-3 text-sm">
          <p className="flex flex-wrap items-center gap-2">
            <DriftStatus check={c} />
            {c.alertOpen ? <SignalBadge signal="beyond">alert open</SignalBadge> : null}
            <span className="text-ink-soft">{formatDateTime(c.finishedAt ?? c.createdAt)}</span>
            {c.trialId !== null ? (
              <Link to={paths.trial(teamSlug, c.trialId)} className="underline">
                trial #{c.trialId}
              </Link>
            ) : null}
          </p>
          {c.summary ? <p className="mt-1">{c.summary}</p> : null}
          {c.findings.length > 0 ? (
            <ul className="mt-1 list-disc pl-5 text-ink-soft">
              {c.findings.map((f) => (
                <li key={f}>{f}</li>
              ))}
            </ul>
          ) : null}
        </li>
      ))}
    </ol>
  );
}
