/**
 * Whether the server last said it cannot reach its database (503 `unavailable`). While it does, one banner says so,
 * reads keep retrying quietly, and this module asks `/api/ready` every few seconds; when the answer is yes it tells
 * its listeners (the provider refetches what is on screen).
 */
type Listener = () => void;

let away = false;
let timer: ReturnType<typeof setTimeout> | null = null;
const listeners = new Set<Listener>();
const backListeners = new Set<Listener>();

function set(value: boolean) {
  if (away === value) return;
  away = value;
  for (const l of listeners) l();
  if (!value) for (const l of backListeners) l();
}

async function lookAgain(afterSeconds: number) {
  timer = null;
  let ready = false;
  try {
    ready = (await fetch('/api/ready', { headers: { Accept: 'application/json' }, cache: 'no-store' })).ok;
  } catch {
    ready = false;
  }
  if (ready) set(false);
  else schedule(afterSeconds);
}

function schedule(afterSeconds: number) {
  timer ??= setTimeout(() => void lookAgain(afterSeconds), afterSeconds * 1000);
}

/** Called by the API client on a 503 `unavailable`, with the reply's Retry-After (seconds). */
export function noticeDatabaseAway(retryAfterSeconds: number): void {
  set(true);
  schedule(Math.min(Math.max(retryAfterSeconds || 5, 1), 60));
}

export const isDatabaseAway = (): boolean => away;

/** For useSyncExternalStore. */
export function subscribeDatabaseOutage(listener: Listener): () => void {
  listeners.add(listener);
  return () => listeners.delete(listener);
}

/** Called once the database answers again. */
export function onDatabaseBack(listener: Listener): () => void {
  backListeners.add(listener);
  return () => backListeners.delete(listener);
}
