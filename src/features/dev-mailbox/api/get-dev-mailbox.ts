import { queryOptions, useQuery } from "@tanstack/react-query";
import { apiPaths } from "@/config/paths";
import { ApiError, api } from "@/lib/api-client";
import { queryKeys } from "@/lib/query-keys";

/** One message as the local fake SMTP server received it (server/routes/dev-mailbox.ts). */
export interface DevMailMessage {
  id: number;
  from: string;
  /** Envelope recipients. */
  to: string[];
  subject: string;
  /** The plain-text part; empty when the message had none. */
  text: string | null;
  /** The HTML part, as sent; only ever shown in a sandboxed frame. */
  html: string | null;
  sizeBytes: number;
  receivedAt: string;
}

export interface DevMailboxQuery {
  /** Only the messages to this recipient (an e-mail address), or every message. */
  to?: string;
  /** Newest first, at most this many (the server allows 1–500). */
  limit: number;
}

/** How many messages the page lists: enough for a working session, small enough to stay quick. */
export const DEV_MAILBOX_LIMIT = 100;

export function getDevMailbox(query: DevMailboxQuery, signal?: AbortSignal): Promise<{ messages: DevMailMessage[] }> {
  return api.get<{ messages: DevMailMessage[] }>(apiPaths.devMailbox(query), { signal });
}

export function getDevMailboxQueryOptions(query: DevMailboxQuery) {
  return queryOptions({
    queryKey: queryKeys.devMailbox.list({ to: query.to ?? null, limit: query.limit }),
    queryFn: ({ signal }) => getDevMailbox(query, signal).then((body) => body.messages),
    // New mail can arrive at any moment: each visit asks again rather than showing a 30 s old list.
    staleTime: 0,
  });
}

export function useDevMailbox(query: DevMailboxQuery) {
  return useQuery(getDevMailboxQueryOptions(query));
}

/** True when the server has no local mailbox because it sends real e-mail. */
export function isNoLocalMailbox(error: unknown): boolean {
  return error instanceof ApiError && error.status === 404;
}
