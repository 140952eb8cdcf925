import { useQuery, useQueryClient } from '@tanstack/react-query';
import { useEffect } from 'react';
import { csrfToken } from '../../../lib/api-client';
import { flushOutbox } from '../../../lib/field/outbox';
import type { SessionView } from '../../../../shared/auth/views';
import { fieldCopyRefreshOptions } from '../api/get-field-copy';
import { fieldKeys } from '../api/keys';

/**
 * Keeps the phone's field copy fresh while there is signal and sends what waits in the outbox: at app start,
 * on reconnect and after each refresh. Draws nothing.
 */
export function FieldSync({ session }: { session: SessionView }) {
  const queryClient = useQueryClient();
  const refresh = useQuery(fieldCopyRefreshOptions(session));
  const userId = session.user.id;

  useEffect(() => {
    if (refresh.data) queryClient.setQueryData(fieldKeys.stored(), refresh.data);
  }, [refresh.data, queryClient]);

  useEffect(() => {
    const send = async () => {
      const { sent } = await flushOutbox(userId, csrfToken);
      // What arrived may have held an item or changed a tip's state: read everything again, the copy too.
      if (sent) await queryClient.invalidateQueries();
    };
    void send();
    window.addEventListener('online', send);
    return () => window.removeEventListener('online', send);
  }, [userId, queryClient, refresh.dataUpdatedAt]);

  return null;
}
