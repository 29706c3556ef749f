import { QueryClient } from '@tanstack/react-query';
import { ApiError } from './api-error';

/** One client for the app: no retries on 4xx (the request itself is wrong), a few on network/5xx. */
export const queryClient = new QueryClient({
  defaultOptions: {
    queries: {
      retry: (failureCount, error) =>
        !(error instanceof ApiError && error.status >= 400 && error.status < 500) && failureCount < 2,
      staleTime: 30_000,
    },
  },
});
