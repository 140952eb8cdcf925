export const routinesKeys = {
  all: ['routines'] as const,
  list: () => [...routinesKeys.all, 'list'] as const,
};
