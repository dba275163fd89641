import { QueryClient } from "@tanstack/react-query";
import { RequestError } from "@/lib/query/fetcher";

// Client errors (4xx) will not fix themselves on retry; only server or network trouble is retried.
function shouldRetry(failureCount: number, error: unknown): boolean {
  if (error instanceof RequestError && error.status >= 400 && error.status < 500) return false;
  return failureCount < 2;
}

export function makeQueryClient(): QueryClient {
  return new QueryClient({
    defaultOptions: {
      queries: { staleTime: 30_000, retry: shouldRetry, refetchOnWindowFocus: true },
      mutations: { retry: false },
    },
  });
}
