import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '@console/lib/api-client';
import { isApiProblem } from '@console/lib/api-problem';
import type { OutboxMessageList, OutboxMessageSummary } from '@shared/schemas/dev-outbox';
import { outboxKeys } from './keys';

/** The caught e-mails, or null when this server has no development outbox (it answers 404). */
export async function getOutbox(): Promise<OutboxMessageSummary[] | null> {
  try {
    return (await apiClient.get<OutboxMessageList>('/dev/outbox')).data;
  } catch (error) {
    if (isApiProblem(error) && error.status === 404) return null;
    throw error;
  }
}

export const getOutboxQueryOptions = () => queryOptions({ queryKey: outboxKeys.list(), queryFn: getOutbox, retry: false });

/** Polls while the page is open, so an e-mail sent from another tab shows up by itself. */
export const useOutbox = () => useQuery({ ...getOutboxQueryOptions(), refetchInterval: 5_000 });

/**
 * Whether to offer the Outbox page: asked once per session of a member who may read it, so a production
 * console (no outbox, 404) never shows the entry.
 */
export const useOutboxAvailable = (enabled: boolean) =>
  useQuery({ ...getOutboxQueryOptions(), enabled, staleTime: Infinity, select: (messages) => messages !== null }).data === true;
