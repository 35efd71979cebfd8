import { useState, type ReactNode } from 'react';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { AppError } from '#shared/errors.ts';
import { ToastProvider } from '../components/ui/toast.tsx';

/** Retrying is for passing faults: a 4xx answer will not change on the second try. */
function shouldRetry(failureCount: number, error: unknown): boolean {
  if (error instanceof AppError && error.status < 500) return false;
  return failureCount < 2;
}

export function AppProvider({ children }: { children: ReactNode }) {
  const [queryClient] = useState(
    () => new QueryClient({ defaultOptions: { queries: { retry: shouldRetry, staleTime: 30_000, refetchOnWindowFocus: false } } }),
  );
  return (
    <QueryClientProvider client={queryClient}>
      <ToastProvider>{children}</ToastProvider>
    </QueryClientProvider>
  );
}
