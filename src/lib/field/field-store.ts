/**
 * What a technician's phone keeps for work without signal, in IndexedDB (through `idb`): the field copy
 * (with the session it belongs to) and the outbox of field records. Nothing else of the firm's data.
 * Read by the pages and by the service worker (Background Sync), so it imports no browser-window API.
 */
import { openDB, type DBSchema, type IDBPDatabase } from 'idb';
import type { SessionView } from '../../../shared/auth/views';
import type { FieldCopyView } from '../../../shared/field/views';
import type { CheckPayload } from '../../../shared/schemas/checks';

export type StoredCopy = { session: SessionView; copy: FieldCopyView; storedAt: string };

export type QueuedPhoto = { name: string; type: string; size: number; blob: Blob };

/** The request the outbox sends, kept as it was written on the phone. */
export type FieldRequest =
  { kind: 'check'; payload: CheckPayload & { id: string } } | { kind: 'incident'; fields: Record<string, string> & { id: string }; photos: QueuedPhoto[] };

export type OutboxState = 'waiting' | 'sent' | 'refused';

export type OutboxRecord = {
  id: string;
  userId: string;
  /** What a person recognises it by: "Tip validation · TIP-012 · vertical". */
  title: string;
  assetId: string;
  queuedAt: string;
  state: OutboxState;
  request: FieldRequest;
  /** The form's own values, so a refused record opens again as it was written. */
  draft: unknown;
  attempts: number;
  lastTriedAt: string | null;
  /** The server's answer: the stored record once sent, the reason once refused. */
  reply: unknown;
  refusal: { status: number; code: string; message: string; fields: Record<string, string> } | null;
  sentAt: string | null;
};

interface FieldDb extends DBSchema {
  copy: { key: 'current'; value: StoredCopy };
  outbox: { key: string; value: OutboxRecord; indexes: { byQueuedAt: string } };
}

const DB_NAME = 'nestkeeper-field';
let opening: Promise<IDBPDatabase<FieldDb>> | null = null;

export function fieldDb(): Promise<IDBPDatabase<FieldDb>> {
  opening ??= openDB<FieldDb>(DB_NAME, 1, {
    upgrade(db) {
      db.createObjectStore('copy');
      db.createObjectStore('outbox', { keyPath: 'id' }).createIndex('byQueuedAt', 'queuedAt');
    },
  });
  return opening;
}

export const readCopy = async (): Promise<StoredCopy | null> => (await (await fieldDb()).get('copy', 'current')) ?? null;

/** A new copy replaces the old one; a copy of another person's kit never stays beside it. */
export async function writeCopy(stored: StoredCopy): Promise<void> {
  await (await fieldDb()).put('copy', stored, 'current');
}

export const outboxRecords = async (): Promise<OutboxRecord[]> => (await fieldDb()).getAllFromIndex('outbox', 'byQueuedAt');

export const outboxRecord = async (id: string): Promise<OutboxRecord | null> => (await (await fieldDb()).get('outbox', id)) ?? null;

export async function putOutboxRecord(record: OutboxRecord): Promise<void> {
  await (await fieldDb()).put('outbox', record);
}

export async function deleteOutboxRecord(id: string): Promise<void> {
  await (await fieldDb()).delete('outbox', id);
}

/** Signing out: the copy and every queued record leave the phone. */
export async function eraseFieldData(): Promise<void> {
  const db = await fieldDb();
  const tx = db.transaction(['copy', 'outbox'], 'readwrite');
  await Promise.all([tx.objectStore('copy').clear(), tx.objectStore('outbox').clear(), tx.done]);
}
