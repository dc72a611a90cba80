export const messageKeys = {
  all: ['messages'] as const,
  unread: () => [...messageKeys.all, 'unread'] as const,
  thread: (orderId: string) => [...messageKeys.all, 'thread', orderId] as const,
};
