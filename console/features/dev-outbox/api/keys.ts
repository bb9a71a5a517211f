export const outboxKeys = {
  all: ['dev-outbox'] as const,
  list: () => [...outboxKeys.all, 'list'] as const,
  message: (messageId: string) => [...outboxKeys.all, 'message', messageId] as const,
};
