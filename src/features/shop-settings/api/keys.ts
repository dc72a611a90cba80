export const shopSettingsKeys = {
  all: ['own-shop'] as const,
  detail: () => [...shopSettingsKeys.all, 'detail'] as const,
};
