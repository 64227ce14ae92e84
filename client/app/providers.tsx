import { QueryCache, QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { RouterProvider } from 'react-router-dom';
import { ApiError } from '../api/api-client.ts';
import { Toaster } from '../components/toaster.tsx';
import { router } from './router.tsx';

export const queryClient = new QueryClient({
  queryCache: new QueryCache({
    onError: (error) => console.warn('Background request failed:', error.message),
  }),
  defaultOptions: {
    queries: {
      staleTime: 10_000,
      // A 4xx will not change on a second try; a network fault or a 5xx may.
      retry: (count, error) =>
        !(error instanceof ApiError && error.status >= 400 && error.status < 500) && count < 1,
    },
  },
});

export function Providers() {
  return (
    <QueryClientProvider client={queryClient}>
      <RouterProvider router={router} />
      <Toaster />
    </QueryClientProvider>
  );
}
