export const fieldKeys = {
  all: ['field'] as const,
  /** The copy as the phone stored it (IndexedDB). */
  stored: () => [...fieldKeys.all, 'stored'] as const,
  /** Asking the server for a fresh copy, per person. */
  refresh: (userId: string) => [...fieldKeys.all, 'refresh', userId] as const,
  outboxRecord: (id: string) => [...fieldKeys.all, 'outbox', id] as const,
};
