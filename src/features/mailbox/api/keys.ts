export interface MailboxPageParams {
  limit: number;
  offset: number;
}

export const mailboxKeys = {
  all: ['mailbox'] as const,
  list: (page: MailboxPageParams) => [...mailboxKeys.all, 'list', page] as const,
};
