import { QueryCache, QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { RouterProvider } from 'react-router-dom';
import { router } from './router.tsx';

export const queryClient = new QueryClient({
  queryCache: new QueryCache({
    onError: (error) => console.warn('Background request failed:', error.message),
  }),
  defaultOptions: { queries: { staleTime: 10_000, retry: 1 } },
});

export function Providers() {
  return (
    <QueryClientProvider client={queryClient}>
      <RouterProvider router={router} />
    </QueryClientProvider>
  );
}
