import type { ReactNode } from 'react';
import { QueryClientProvider } from '@tanstack/react-query';
import { queryClient } from '@/lib/query-client';
import { UnitSystemProvider } from '@/lib/unit-system';

export function AppProviders({ children }: { children: ReactNode }) {
  return (
    <QueryClientProvider client={queryClient}>
      <UnitSystemProvider>{children}</UnitSystemProvider>
    </QueryClientProvider>
  );
}
