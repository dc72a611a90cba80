export const uploadKeys = {
  all: ['uploads'] as const,
  photos: () => [...uploadKeys.all, 'photos'] as const,
  motifs: () => [...uploadKeys.all, 'motifs'] as const,
  motif: (id: string) => [...uploadKeys.all, 'motifs', id] as const,
};
