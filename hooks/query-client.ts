import { QueryClient } from "@tanstack/react-query";

/** Named staleness policies. */
export const STALE = {
  /** reference tables shipped with the app change only with a release or a lead's correction */
  reference: 10 * 60 * 1000,
  /** group records other people edit */
  shared: 30 * 1000,
  /** who I am and which groups I belong to */
  session: 60 * 1000,
} as const;

export function createQueryClient(): QueryClient {
  return new QueryClient({ defaultOptions: { queries: { staleTime: STALE.shared, retry: 1 } } });
}
