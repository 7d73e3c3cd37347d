import { queryOptions } from "@tanstack/react-query";
import { apiGet } from "../../api/client";
import type { OutboxMessage, ReceivedMessage } from "../../api/types";

/** Query keys for outgoing mail and the local mail catcher, admin only. */
export const mailKeys = {
  all: ["mail"] as const,
  outbox: () => [...mailKeys.all, "outbox"] as const,
  received: () => [...mailKeys.all, "received"] as const,
};

/** GET /api/mail/outbox: messages queued or sent by Isobatch. */
export function outboxQueryOptions() {
  return queryOptions({
    queryKey: mailKeys.outbox(),
    queryFn: ({ signal }) => apiGet<{ messages: OutboxMessage[] }>("/api/mail/outbox", signal),
    select: (body) => body.messages,
    refetchInterval: 15_000,
  });
}

/** GET /api/mail/received: what the local mail catcher has received. */
export function receivedMailQueryOptions() {
  return queryOptions({
    queryKey: mailKeys.received(),
    queryFn: ({ signal }) => apiGet<{ messages: ReceivedMessage[] }>("/api/mail/received", signal),
    select: (body) => body.messages,
    refetchInterval: 15_000,
  });
}
