import { QueryClient } from '@tanstack/react-query';

/** One query client for the site: modest retries, data considered fresh for 30 s. */
export function createQueryClient(): QueryClient {
  return new QueryClient({
    defaultOptions: { queries: { staleTime: 30_000, retry: 1, refetchOnWindowFocus: false } },
  });
}
