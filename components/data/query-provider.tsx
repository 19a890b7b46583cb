"use client";

import { QueryClient, QueryClientProvider } from "@tanstack/react-query";
import { useState, type ReactNode } from "react";

export type QueryProviderProps = { children: ReactNode };

/** Waits 1 s, 2 s, 4 s ... up to 30 s between retries of a failed request. */
export function getRetryDelayMs(attempt: number): number {
  return Math.min(30_000, 1000 * 2 ** attempt);
}

function createQueryClient(): QueryClient {
  return new QueryClient({
    defaultOptions: {
      queries: {
        // Live parts poll; a hidden tab stops polling and catches up when shown again.
        refetchIntervalInBackground: false,
        refetchOnWindowFocus: true,
        retry: 4,
        retryDelay: getRetryDelayMs,
        staleTime: 1000,
      },
    },
  });
}

/** TanStack Query for the dashboard's live parts: one client per browser tab. */
export function QueryProvider({ children }: QueryProviderProps) {
  const [client] = useState(createQueryClient);
  return <QueryClientProvider client={client}>{children}</QueryClientProvider>;
}
