import { useQuery } from '@tanstack/react-query';
import { useCallback, useMemo, useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import { paths } from '@client/app/paths.ts';
import { EmptyState } from '@client/components/empty-state.tsx';
import { ErrorState } from '@client/components/error-state.tsx';
import { LoadingState } from '@client/components/loading-state.tsx';
import { formatDateTime } from '@client/components/number-format.ts';
import { PageHeader } from '@client/components/page-header.tsx';
import {
  candidateQueries,
  revisionQueries,
} from '@client/features/candidates/candidates.queries.ts';
import { useCurrentTeam } from '@client/features/teams/use-current-team.ts';
import type { CandidateDetail } from '@shared/api/candidates.ts';
import type { Comment } from '@shared/api/comments.ts';
import { routineTitles } from '@shared/routines.ts';
import { AuthorGuidance } from './author-guidance.tsx';
import { CandidateStateBadge } from '@client/features/candidates/state-badge.tsx';
import { CommentForm } from './comment-form.tsx';
import { CommentList } from './comment-list.tsx';
import { commentQueries } from './review.queries.ts';
import { LineCommentPanel } from './line-comment-panel.tsx';
import { ReviewHistory } from './review-history.tsx';
import { Section } from './section.tsx';
import { SourceDiff } from './source-diff.tsx';
import { TrialVerdictCard } from './trial-verdict-card.tsx';
import { VerdictPanel } from './verdict-panel.tsx';
import './line-comments.css';

/** The candidate page: evidence, the diff with line comments, the thread and the verdicts. */
export default function ReviewPage() {
  const { candidateId: rawId = '' } = useParams();
  const candidateId = Number(rawId);
  const { teamSlug, user } = useCurrentTeam();
  const candidate = useQuery({
    ...candidateQueries.detail(candidateId),
    enabled: Number.isInteger(candidateId) && candidateId > 0,
  });

  if (!Number.isInteger(candidateId) || candidateId <= 0) {
    return <ErrorState error={new Error(`“${rawId}” is not a candidate number.`)} />;
  }
  if (candidate.isPending) return <LoadingState label="Loading the candidate…" />;
  if (candidate.isError) {
    return <ErrorState error={candidate.error} onRetry={() => void candidate.refetch()} />;
  }
  return <ReviewView candidate={candidate.data} teamSlug={teamSlug} userId={user?.id ?? null} />;
}

function ReviewView({
  candidate,
  teamSlug,
  userId,
}: {
  candidate: CandidateDetail;
  teamSlug: string;
  userId: number | null;
}) {
  const latest = candidate.revisions.at(-1);
  const [shownRevisionId, setShownRevisionId] = useState<number | null>(null);
  const revisionId = shownRevisionId ?? latest?.id ?? null;
  const shown = candidate.revisions.find((r) => r.id === revisionId) ?? latest;
  const comments = useQuery(commentQueries.list(candidate.id));
  const isOwn = userId !== null && userId === candidate.author.id;

  const routineLink = paths.routine(teamSlug, candidate.routine.id);
  return (
    <div>
      <PageHeader
        eyebrow={
          <>
            <Link to={routineLink} className="underline">
              {candidate.routine.title}
            </Link>{' '}
            · {routineTitles[candidate.routine.contract]} · candidate #{candidate.id}
          </>
        }
        title={candidate.title}
        description={
          <>
            by {candidate.author.name ?? candidate.author.login}
            {isOwn ? ' (you)' : ''} · {candidate.revisions.length}{' '}
            {candidate.revisions.length === 1 ? 'revision' : 'revisions'} · changed{' '}
            {formatDateTime(candidate.updatedAt)}
          </>
        }
        actions={<CandidateStateBadge state={candidate.state} />}
      />

      {candidate.description ? (
        <p className="mb-6 max-w-prose whitespace-pre-line text-ink-soft">
          {candidate.description}
        </p>
      ) : null}

      <div className="grid gap-6 lg:grid-cols-2">
        <TrialVerdictCard candidate={candidate} teamSlug={teamSlug} />
        <VerdictPanel candidate={candidate} userId={userId} />
      </div>

      <AuthorGuidance candidate={candidate} teamSlug={teamSlug} isOwn={isOwn} />

      <Section
        title="Source against the incumbent"
        id="source-diff"
        actions={
          candidate.revisions.length > 1 ? (
            <label className="text-sm">
              <span className="mr-2 text-ink-soft">Revision shown</span>
              <select
                value={shown?.id ?? ''}
                onChange={(e) => setShownRevisionId(Number(e.target.value))}
                className="rounded border border-rule bg-white px-2 py-1"
              >
                {candidate.revisions.map((r) => (
                  <option key={r.id} value={r.id}>
                    revision {r.number}
                    {r.id === latest?.id ? ' (latest)' : ''}
                  </option>
                ))}
              </select>
            </label>
          ) : null
        }
      >
        {shown ? (
          <DiffWithComments
            candidateId={candidate.id}
            revisionId={shown.id}
            revisionNumber={shown.number}
            incumbentRevisionId={candidate.routine.incumbentRevisionId}
            threadComments={comments.data?.items ?? []}
          />
        ) : (
          <EmptyState title="This candidate has no revision yet." />
        )}
      </Section>

      <Section title="Discussion" id="discussion">
        {comments.isPending ? (
          <LoadingState label="Loading the comments…" />
        ) : comments.isError ? (
          <ErrorState error={comments.error} onRetry={() => void comments.refetch()} />
        ) : (
          <CommentList
            comments={comments.data.items.filter((c) => c.line === null)}
            empty="No general comments yet."
          />
        )}
        <div className="mt-4 max-w-2xl">
          <CommentForm
            candidateId={candidate.id}
            label="Add to the discussion"
            submitLabel="Comment"
          />
        </div>
      </Section>

      <Section title="Verdicts" id="verdicts">
        <ReviewHistory reviews={candidate.reviews} />
      </Section>
    </div>
  );
}

function DiffWithComments({
  candidateId,
  revisionId,
  revisionNumber,
  incumbentRevisionId,
  threadComments,
}: {
  candidateId: number;
  revisionId: number;
  revisionNumber: number;
  incumbentRevisionId: number | null;
  threadComments: readonly Comment[];
}) {
  const revision = useQuery(revisionQueries.detail(revisionId));
  const incumbent = useQuery({
    ...revisionQueries.detail(incumbentRevisionId ?? 0),
    enabled: incumbentRevisionId !== null,
  });
  const [pickedLine, setPickedLine] = useState<number | null>(null);
  const onPickLine = useCallback((line: number) => setPickedLine(line), []);
  const lineComments = useMemo(
    () => threadComments.filter((c) => c.revisionId === revisionId && c.line !== null),
    [threadComments, revisionId],
  );

  if (revision.isPending || (incumbentRevisionId !== null && incumbent.isPending)) {
    return <LoadingState label="Loading the sources…" />;
  }
  if (revision.isError) return <ErrorState error={revision.error} />;
  if (incumbent.isError) return <ErrorState error={incumbent.error} />;
  const source = revision.data.source;
  return (
    <div className="grid gap-4">
      <div>
        <p className="mb-2 text-sm text-ink-soft">
          {incumbent.data
            ? `Left: the incumbent (revision ${incumbent.data.number}). Right: revision ${revisionNumber} of this candidate.`
            : `The routine has no incumbent yet, so all of revision ${revisionNumber} shows as new.`}{' '}
          Click a line number on the right to comment on that line.
        </p>
        <SourceDiff
          original={incumbent.data?.source ?? ''}
          modified={source}
          modelKey={`${incumbentRevisionId ?? 'none'}-${revisionId}`}
          comments={lineComments}
          onPickLine={onPickLine}
        />
      </div>
      <LineCommentPanel
        candidateId={candidateId}
        revisionId={revisionId}
        revisionNumber={revisionNumber}
        source={source}
        comments={lineComments}
        pickedLine={pickedLine}
        onPickLine={setPickedLine}
      />
    </div>
  );
}
