export const proofEditKeys = {
  all: ['proof-edit'] as const,
  line: (lineId: string) => [...proofEditKeys.all, lineId] as const,
};
