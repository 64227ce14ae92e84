import { useQuery } from '@tanstack/react-query';
import { useSearchParams } from 'react-router-dom';
import { LoadingState } from '@client/components/loading-state.tsx';
import { meQueries } from '@client/features/auth/me.queries.ts';
import { MyTeams } from '@client/features/teams/my-teams.tsx';

const steps = [
  ['Submit', 'Write a kernel against its contract, paste it, or send it from CI with a token.'],
  [
    'Trial',
    'A sandbox runs it on the matrix set beside the incumbent: backward and forward error, growth, timing.',
  ],
  ['Review', 'Reviewers read the evidence and the source diff, then sign off or send back.'],
  [
    'Promote',
    'A maintainer promotes a cleared revision; the logbook keeps every incumbent’s record.',
  ],
] as const;

/** The start page: what Stablehand is when signed out, my teams when signed in. */
export function HomePage() {
  const me = useQuery(meQueries.current());
  const [params] = useSearchParams();
  if (me.isPending) return <LoadingState />;
  if (me.data) return <MyTeams me={me.data} />;
  return <SignedOutHome signInFailed={params.get('signin') === 'failed'} />;
}

function SignedOutHome({ signInFailed }: { signInFailed: boolean }) {
  return (
    <div className="grid gap-12 md:grid-cols-[3fr_2fr]">
      <section>
        <h1 className="text-4xl font-semibold leading-tight tracking-tight">
          Review the numerical kernels your team ships.
        </h1>
        <p className="mt-4 max-w-prose text-lg text-ink-soft">
          Stablehand runs each candidate LU, Cholesky, LDLᵀ, QR or triangular-solve kernel on your
          reference matrices, next to the one in production, and shows reviewers how its accuracy
          and speed compare.
        </p>
        {signInFailed ? (
          <p role="alert" className="mt-6 text-beyond">
            <span aria-hidden="true">✕ </span>Sign-in did not complete. Please try again.
          </p>
        ) : null}
        <a
          href="/auth/github"
          className="mt-8 inline-block rounded border border-ink bg-ink px-5 py-2 font-medium text-paper hover:bg-ink-soft"
        >
          Sign in with GitHub
        </a>
      </section>
      <section aria-labelledby="how-it-works" className="border-l border-rule pl-8">
        <h2
          id="how-it-works"
          className="text-sm font-semibold uppercase tracking-wider text-ink-soft"
        >
          How a kernel gets to production
        </h2>
        <ol className="mt-4 space-y-4">
          {steps.map(([title, text], i) => (
            <li key={title} className="grid grid-cols-[2rem_1fr]">
              <span className="font-mono text-ink-soft">{i + 1}.</span>
              <span>
                <span className="font-medium">{title}.</span>{' '}
                <span className="text-ink-soft">{text}</span>
              </span>
            </li>
          ))}
        </ol>
        <p className="mt-8 font-mono text-sm text-ink-soft figures">
          factor ratio = ‖PA − LU‖₁ / (n·‖A‖₁·u)
          <br />
          unit roundoff u = 2⁻⁵³
        </p>
      </section>
    </div>
  );
}
