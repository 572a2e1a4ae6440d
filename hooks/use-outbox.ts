import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { api } from "./api";

/* The developer's outbox (development only): mail the local SMTP stand-in caught. */

export interface OutboxMessage {
  id: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string | null;
  links: string[];
  receivedAt: string;
}

export const outboxKeys = { all: ["dev-outbox"] as const };

/** Always fresh: a developer opens it to see the message that just went out. */
export const outboxQuery = () =>
  queryOptions({ queryKey: outboxKeys.all, queryFn: ({ signal }) => api<{ messages: OutboxMessage[] }>("/api/dev/outbox", { signal }), staleTime: 0 });

export function useOutboxQuery() {
  return useQuery({ ...outboxQuery(), retry: false });
}

/** Invalidates the outbox. */
export function useClearOutboxMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => api("/api/dev/outbox", { method: "DELETE" }),
    onSuccess: () => qc.invalidateQueries({ queryKey: outboxKeys.all }),
  });
}
