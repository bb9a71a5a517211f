import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '@console/lib/api-client';
import type { OutboxMessage } from '@shared/schemas/dev-outbox';
import { outboxKeys } from './keys';

export const getOutboxMessage = (messageId: string) => apiClient.get<OutboxMessage>(`/dev/outbox/${encodeURIComponent(messageId)}`);

export const getOutboxMessageQueryOptions = (messageId: string) =>
  queryOptions({ queryKey: outboxKeys.message(messageId), queryFn: () => getOutboxMessage(messageId), staleTime: Infinity });

export const useOutboxMessage = (messageId: string | null) =>
  useQuery({ ...getOutboxMessageQueryOptions(messageId ?? ''), enabled: messageId !== null });
