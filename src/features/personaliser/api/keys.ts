export const personaliserKeys = {
  all: ['personaliser'] as const,
  fonts: () => [...personaliserKeys.all, 'fonts'] as const,
};
