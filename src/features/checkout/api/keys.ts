export const checkoutKeys = {
  all: ['checkout'] as const,
  status: (sessionId: string) => [...checkoutKeys.all, 'status', sessionId] as const,
  latest: (viewer: string) => [...checkoutKeys.all, 'latest', viewer] as const,
};
