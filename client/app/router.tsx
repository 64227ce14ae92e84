import { createBrowserRouter, Navigate, useParams } from 'react-router-dom';
import { AppShell } from '../components/app-shell.tsx';
import { LoadingState } from '../components/loading-state.tsx';
import { RouteError } from '../components/route-error.tsx';
import { RoutinePage } from '../features/routines/routine-page.tsx';
import { RoutinesPage } from '../features/routines/routines-page.tsx';
import { TeamGate } from '../features/teams/team-gate.tsx';
import { paths } from './paths.ts';
import { HomePage } from './routes/home.tsx';
import { NotFoundPage } from './routes/not-found.tsx';

function TeamIndex() {
  const { teamSlug = '' } = useParams();
  return <Navigate to={paths.routines(teamSlug)} replace />;
}

export const router = createBrowserRouter([
  {
    element: <AppShell />,
    errorElement: <RouteError />,
    // Shown while a lazily loaded page (editor, report) arrives on a direct visit.
    hydrateFallbackElement: <LoadingState />,
    children: [
      { index: true, element: <HomePage /> },
      {
        path: 'teams/:teamSlug',
        element: <TeamGate />,
        children: [
          { index: true, element: <TeamIndex /> },
          { path: 'routines', element: <RoutinesPage /> },
          { path: 'routines/:routineId', element: <RoutinePage /> },
          {
            path: 'routines/:routineId/submit',
            lazy: async () => ({
              Component: (await import('../features/candidates/submit-page.tsx')).SubmitPage,
            }),
          },
          {
            path: 'candidates/:candidateId/revise',
            lazy: async () => ({
              Component: (await import('../features/candidates/revise-page.tsx')).RevisePage,
            }),
          },
          {
            path: 'trials/:trialId',
            lazy: async () => ({
              Component: (await import('../features/trials/trial-report-page.tsx')).TrialReportPage,
            }),
          },
          // ── Part B's pages ──
          {
            path: 'candidates/:candidateId',
            lazy: async () => ({
              Component: (await import('../features/review/review-page.tsx')).default,
            }),
          },
          {
            path: 'routines/:routineId/promotions',
            lazy: async () => ({
              Component: (await import('../features/promotions/promotions-page.tsx')).default,
            }),
          },
          {
            path: 'logbook',
            lazy: async () => ({
              Component: (await import('../features/logbook/team-logbook-page.tsx')).default,
            }),
          },
          {
            path: 'routines/:routineId/logbook',
            lazy: async () => ({
              Component: (await import('../features/logbook/routine-logbook-page.tsx')).default,
            }),
          },
          {
            path: 'team',
            lazy: async () => ({
              Component: (await import('../features/team-admin/team-admin-page.tsx')).default,
            }),
          },
          // ── end of part B's slot ──
        ],
      },
      {
        path: 'invitations/:token',
        lazy: async () => ({
          Component: (await import('../features/invitations/invitation-page.tsx')).default,
        }),
      },
      {
        path: 'dev/mailbox',
        lazy: async () => ({
          Component: (await import('../features/mailbox/mailbox-page.tsx')).default,
        }),
      },
      { path: '*', element: <NotFoundPage /> },
    ],
  },
]);
