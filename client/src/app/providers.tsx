import { useState } from 'react';
import { QueryClientProvider } from '@tanstack/react-query';
import { RouterProvider } from 'react-router-dom';
import { LanguageProvider } from '../lib/language';
import { createQueryClient } from '../lib/query-client';
import { createAppRouter } from './router';

/** Staff screens speak English; the passenger's page sets its own language inside (routes/offer-your-seat.tsx). */
export function AppProviders() {
  const [queryClient] = useState(createQueryClient);
  const [router] = useState(() => createAppRouter(queryClient));
  return (
    <LanguageProvider initial="en">
      <QueryClientProvider client={queryClient}>
        <RouterProvider router={router} />
      </QueryClientProvider>
    </LanguageProvider>
  );
}
