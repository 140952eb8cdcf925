/**
 * The outbox of field records (checks and damage reports, photos included): each is saved on the phone first
 * under the id the phone gives it, then sent whenever there is signal — at once, on reconnect, at app start, and by
 * Background Sync where the browser has it. The server takes that id as the record's idempotency key, so a record
 * sent twice is stored once. A refusal (the item was retired meanwhile, a field the server will not take) stays on
 * the phone with its reason until the person corrects or discards it.
 * Used by the pages and by the service worker: no window-only API here.
 */
import { ApiError, apiErrorFromBody } from '../api-client';
import {
  deleteOutboxRecord,
  eraseFieldData as eraseStore,
  outboxRecord,
  outboxRecords,
  putOutboxRecord,
  type OutboxRecord,
  type QueuedPhoto,
} from './field-store';

export const OUTBOX_SYNC_TAG = 'nestkeeper-outbox';
/** How many photos, and how many bytes of them, may wait on the phone at once (common practice for a phone's spare storage). */
export const MAX_QUEUED_PHOTOS = 30;
export const MAX_QUEUED_PHOTO_BYTES = 150 * 1024 * 1024;
/** Sent records stay listed a week (at most this many), so the technician sees what arrived. */
const KEEP_SENT = 30;
const KEEP_SENT_MS = 7 * 24 * 3600_000;
/** Answers that will not change by sending again: the record waits for the person. */
const REFUSALS = new Set([400, 404, 409, 413, 415, 422]);

type Csrf = () => Promise<string | undefined> | string | undefined;

const channel = typeof BroadcastChannel === 'undefined' ? null : new BroadcastChannel(OUTBOX_SYNC_TAG);
const listeners = new Set<() => void>();
if (channel) channel.onmessage = () => listeners.forEach((l) => l());

/** Called whenever a record is queued, sent, refused or discarded (in this page, another tab or the service worker). */
export function onOutboxChange(listener: () => void): () => void {
  listeners.add(listener);
  return () => listeners.delete(listener);
}

function changed() {
  listeners.forEach((l) => l());
  channel?.postMessage('changed');
}

async function send(record: OutboxRecord, csrf: Csrf): Promise<Response> {
  const headers: Record<string, string> = { Accept: 'application/json' };
  const token = await csrf();
  if (token) headers['X-CSRF-Token'] = token;
  if (record.request.kind === 'check') {
    headers['Content-Type'] = 'application/json';
    return fetch('/api/checks', { method: 'POST', headers, credentials: 'include', body: JSON.stringify(record.request.payload) });
  }
  const form = new FormData();
  for (const [name, value] of Object.entries(record.request.fields)) form.set(name, value);
  for (const photo of record.request.photos) form.append('photos', photo.blob, photo.name);
  return fetch('/api/incidents', { method: 'POST', headers, credentials: 'include', body: form });
}

/** One try; the record as it stands afterwards. No answer at all means no signal: it keeps waiting. */
async function attempt(record: OutboxRecord, csrf: Csrf): Promise<OutboxRecord> {
  const tried = { ...record, attempts: record.attempts + 1, lastTriedAt: new Date().toISOString() };
  let response: Response;
  try {
    response = await send(record, csrf);
  } catch {
    return tried;
  }
  const body: unknown = await response.json().catch(() => undefined);
  if (response.ok) {
    // The photos are on the server now; the phone keeps only the answer.
    const request = record.request.kind === 'incident' ? { ...record.request, photos: [] } : record.request;
    return { ...tried, state: 'sent', request, reply: body, refusal: null, sentAt: new Date().toISOString() };
  }
  if (!REFUSALS.has(response.status)) return tried; // signed out, server busy or away: send again later
  const error = apiErrorFromBody(response.status, body);
  return { ...tried, state: 'refused', refusal: { status: error.status, code: error.code, message: error.message, fields: error.fieldErrors } };
}

async function exclusively(run: () => Promise<void>): Promise<void> {
  // One sender at a time across this phone's tabs and its service worker.
  if (typeof navigator !== 'undefined' && navigator.locks) await navigator.locks.request(OUTBOX_SYNC_TAG, run);
  else await run();
}

/** Sends what waits for this person, oldest first; stops at the first record that finds no signal. */
export async function flushOutbox(userId: string, csrf: Csrf): Promise<{ sent: number }> {
  let sent = 0;
  await exclusively(async () => {
    for (const queued of await outboxRecords()) {
      if (queued.state !== 'waiting' || queued.userId !== userId) continue;
      const after = await attempt(queued, csrf);
      // Discarded while it was on its way: the server's answer does not bring it back.
      if (!(await outboxRecord(queued.id))) continue;
      await putOutboxRecord(after);
      changed();
      if (after.state === 'sent') sent++;
      if (after.state === 'waiting') break;
    }
    await forgetOldSent();
  });
  return { sent };
}

async function forgetOldSent() {
  const sent = (await outboxRecords()).filter((r) => r.state === 'sent').sort((a, b) => (b.sentAt ?? '').localeCompare(a.sentAt ?? ''));
  const old = sent.filter((r, i) => i >= KEEP_SENT || Date.now() - Date.parse(r.sentAt ?? '') > KEEP_SENT_MS);
  for (const r of old) await deleteOutboxRecord(r.id);
}

const photosOf = (r: OutboxRecord) => (r.request.kind === 'incident' && r.state !== 'sent' ? r.request.photos : []);
const bytesOf = (photos: QueuedPhoto[]) => photos.reduce((sum, p) => sum + p.size, 0);
/** Whole megabytes; a few small photos read "under 1 MB", never "0 MB". */
const megabytes = (bytes: number) => (bytes < 1024 * 1024 ? 'under 1 MB' : `${Math.round(bytes / 1024 / 1024)} MB`);

/** Refuses (413) a record whose photos would take the phone past its limits, with what to do about it. */
async function makeRoomFor(record: OutboxRecord) {
  const others = (await outboxRecords()).filter((r) => r.id !== record.id).flatMap(photosOf);
  const adding = photosOf(record);
  const count = others.length + adding.length;
  if (adding.length && (count > MAX_QUEUED_PHOTOS || bytesOf(others) + bytesOf(adding) > MAX_QUEUED_PHOTO_BYTES)) {
    throw new ApiError({
      status: 413,
      code: 'phone_outbox_full',
      message: `This phone already keeps ${others.length} photos (${megabytes(bytesOf(others))}) waiting to be sent, and holds at most ${MAX_QUEUED_PHOTOS} photos or ${megabytes(MAX_QUEUED_PHOTO_BYTES)}. Send what waits first (find signal), or leave some photos out.`,
    });
  }
}

export type QueueOutcome = { state: 'sent'; reply: unknown } | { state: 'waiting' };

/**
 * Saves the record on the phone (replacing a refused one with the same id when corrected), then tries to send it.
 * Sent: the server's answer. No signal: it waits, and Background Sync is asked to send it later.
 * Refused: throws the server's ApiError for the form to show; the record stays in the outbox as refused.
 */
export async function queueFieldRecord(
  record: Pick<OutboxRecord, 'id' | 'userId' | 'title' | 'assetId' | 'request' | 'draft'>,
  csrf: Csrf,
): Promise<QueueOutcome> {
  const queued: OutboxRecord = {
    ...record,
    queuedAt: new Date().toISOString(),
    state: 'waiting',
    attempts: 0,
    lastTriedAt: null,
    reply: null,
    refusal: null,
    sentAt: null,
  };
  await makeRoomFor(queued);
  await putOutboxRecord(queued);
  changed();
  // Ask the browser not to clear this site's storage under pressure: queued records must survive.
  void navigator.storage?.persist?.().catch(() => undefined);
  await flushOutbox(record.userId, csrf);
  const after = await outboxRecord(record.id);
  if (after?.state === 'sent') return { state: 'sent', reply: after.reply };
  if (after?.state === 'refused' && after.refusal) {
    const r = after.refusal;
    throw new ApiError({ status: r.status, code: r.code, message: r.message, details: { fields: r.fields } });
  }
  await askForBackgroundSync();
  return { state: 'waiting' };
}

async function askForBackgroundSync() {
  try {
    const registration = await navigator.serviceWorker?.getRegistration();
    const sync = (registration as (ServiceWorkerRegistration & { sync?: { register(tag: string): Promise<void> } }) | undefined)?.sync;
    await sync?.register(OUTBOX_SYNC_TAG);
  } catch {
    // No Background Sync here: the app sends on reconnect and at start instead.
  }
}

/** The person chose to throw a waiting or refused record away. */
export async function discardFieldRecord(id: string): Promise<void> {
  await deleteOutboxRecord(id);
  changed();
}

/** Signing out: the field copy and every queued record leave the phone. */
export async function eraseFieldData(): Promise<void> {
  await eraseStore();
  changed();
}
