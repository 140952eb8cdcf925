export const authKeys = {
  all: ['auth'] as const,
  me: () => [...authKeys.all, 'me'] as const,
  sessions: () => [...authKeys.all, 'sessions'] as const,
  /** The session kept with the phone's field copy, used while there is no signal. */
  keptOnPhone: () => [...authKeys.all, 'kept-on-phone'] as const,
};
