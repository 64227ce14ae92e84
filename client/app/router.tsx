import { createBrowserRouter, Navigate, useParams } from 'react-router-dom';
import { AppShell } from '../components/app-shell.tsx';
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
          // ── Part B's pages go here (paths in ./paths.ts): ──
          //   candidates/:candidateId                 review page
          //   routines/:routineId/promotions          cleared candidates, promote, reinstate
          //   logbook, routines/:routineId/logbook     logbook
          //   team                                     team admin
          // ── end of part B's slot ──
        ],
      },
      // Part B: the development mailbox at /dev/mailbox goes here.
      { path: '*', element: <NotFoundPage /> },
    ],
  },
]);
