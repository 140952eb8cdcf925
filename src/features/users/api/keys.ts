export const usersKeys = {
  all: ['users'] as const,
  list: () => [...usersKeys.all, 'list'] as const,
  invitations: () => [...usersKeys.all, 'invitations'] as const,
};
