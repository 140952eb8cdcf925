import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { mailboxKeys, type MailboxPageParams } from './keys';
import type { Page } from '../../../../shared/lists/page';
import type { MailMessageView } from '../../../../shared/notifications/views';

export function getMessages(page: MailboxPageParams, signal?: AbortSignal): Promise<Page<MailMessageView>> {
  return apiClient.get<Page<MailMessageView>>('/mailbox', { query: { limit: page.limit, offset: page.offset }, signal });
}

export const messagesQueryOptions = (page: MailboxPageParams) =>
  queryOptions({
    queryKey: mailboxKeys.list(page),
    queryFn: ({ signal }) => getMessages(page, signal),
    placeholderData: keepPreviousData,
    // New mail arrives on its own; look again every half minute while the page is open.
    refetchInterval: 30_000,
  });

export function useMessages(page: MailboxPageParams) {
  return useQuery(messagesQueryOptions(page));
}
