import { onlineManager } from '@tanstack/react-query';
import { useEffect, useState, useSyncExternalStore } from 'react';
import { outboxRecords, type OutboxRecord } from './field-store';
import { onOutboxChange } from './outbox';

/** Whether the phone has a network, as TanStack Query sees it (reads pause while it has none). */
export function useOnline(): boolean {
  return useSyncExternalStore(
    (notify) => onlineManager.subscribe(notify),
    () => onlineManager.isOnline(),
  );
}

/** The outbox as it stands, oldest first; null until read. Follows changes from any tab and the service worker. */
export function useOutbox(): OutboxRecord[] | null {
  const [records, setRecords] = useState<OutboxRecord[] | null>(null);
  useEffect(() => {
    let live = true;
    const load = () => void outboxRecords().then((r) => live && setRecords(r));
    load();
    const stop = onOutboxChange(load);
    return () => {
      live = false;
      stop();
    };
  }, []);
  return records;
}

/** Records that have not reached the server: waiting, or refused and waiting for the person. */
export const unsent = (records: OutboxRecord[] | null) => (records ?? []).filter((r) => r.state !== 'sent');
