export const usersKeys = {
  all: ['users'] as const,
  list: () => [...usersKeys.all, 'list'] as const,
  invitations: () => [...usersKeys.all, 'invitations'] as const,
  staff: (roles: readonly string[]) => [...usersKeys.all, 'staff', [...roles].sort()] as const,
};
