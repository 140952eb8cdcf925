import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { outboxRecord, readCopy, writeCopy, type StoredCopy } from '../../../lib/field/field-store';
import type { SessionView } from '../../../../shared/auth/views';
import type { FieldCopyView } from '../../../../shared/field/views';
import { fieldKeys } from './keys';

/** How often an open app asks for a fresh copy while there is signal (and at once on reconnect). */
const REFRESH_EVERY_MS = 5 * 60_000;

/** GET /api/field/copy, kept on the phone with the session it belongs to. */
export async function refreshFieldCopy(session: SessionView, signal?: AbortSignal): Promise<StoredCopy> {
  const copy = await apiClient.get<FieldCopyView>('/field/copy', { signal });
  const stored = { session, copy, storedAt: new Date().toISOString() };
  await writeCopy(stored);
  return stored;
}

export const fieldCopyRefreshOptions = (session: SessionView) =>
  queryOptions({
    queryKey: fieldKeys.refresh(session.user.id),
    queryFn: ({ signal }) => refreshFieldCopy(session, signal),
    refetchInterval: REFRESH_EVERY_MS,
    staleTime: 60_000,
  });

/** The copy on this phone (no network needed); null when there is none. */
export const storedCopyOptions = () => queryOptions({ queryKey: fieldKeys.stored(), queryFn: readCopy, networkMode: 'always', staleTime: Infinity });

export function useStoredCopy() {
  return useQuery(storedCopyOptions());
}

/** One item of the kit carried, from the copy on this phone. */
export function useFieldItem(id: string) {
  const stored = useStoredCopy();
  return { ...stored, item: stored.data?.copy.items.find((i) => i.id === id) ?? null };
}

/** Asset tag, RFID tag or a QR label's payload (which ends in the item's id), as the server's lookup reads them. */
export function findInCopy(stored: StoredCopy | null | undefined, code: string) {
  const wanted = code.trim().toUpperCase();
  if (!stored || !wanted) return null;
  return (
    stored.copy.items.find((i) => i.id.toUpperCase() === wanted.slice(-36)) ??
    stored.copy.items.find((i) => i.assetTag.toUpperCase() === wanted || (i.rfidTag ?? '').toUpperCase() === wanted) ??
    null
  );
}

/** A record in this phone's outbox (to open a refused one again for correcting); null when it is gone. */
export function useOutboxRecord(id: string | null) {
  return useQuery({
    queryKey: fieldKeys.outboxRecord(id ?? ''),
    queryFn: () => outboxRecord(id ?? ''),
    enabled: !!id,
    networkMode: 'always',
    staleTime: Infinity,
  });
}
