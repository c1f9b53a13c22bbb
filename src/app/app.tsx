import { QueryClientProvider } from '@tanstack/react-query';
import { RouterProvider } from 'react-router-dom';
import { useState } from 'react';
import { createQueryClient } from '@/lib/query-client';
import { seedPreloadedQueries } from '@/lib/preload';
import type { AppRouter } from './router';

function createSeededQueryClient() {
  const queryClient = createQueryClient();
  seedPreloadedQueries(queryClient);
  return queryClient;
}

export function App({ router }: { router: AppRouter }) {
  const [queryClient] = useState(createSeededQueryClient);
  return (
    <QueryClientProvider client={queryClient}>
      <RouterProvider router={router} />
    </QueryClientProvider>
  );
}
