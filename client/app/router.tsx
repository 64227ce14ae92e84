import { createBrowserRouter } from 'react-router-dom';
import { AppShell } from '../components/app-shell.tsx';
import { RouteError } from '../components/route-error.tsx';
import { HomePage } from './routes/home.tsx';
import { NotFoundPage } from './routes/not-found.tsx';

export const router = createBrowserRouter([
  {
    element: <AppShell />,
    errorElement: <RouteError />,
    children: [
      { index: true, element: <HomePage /> },
      { path: '*', element: <NotFoundPage /> },
    ],
  },
]);
