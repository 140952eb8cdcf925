/**
 * Nestkeeper's service worker (built by vite-plugin-pwa's injectManifest): precaches the app shell, its screens and
 * fonts so the technician's pages open without signal; answers navigations with the shell except under /api (API
 * answers are never cached here); sends the field outbox on Background Sync; switches versions only when asked.
 */
import { cleanupOutdatedCaches, createHandlerBoundToURL, precacheAndRoute, type PrecacheEntry } from 'workbox-precaching';
import { NavigationRoute, registerRoute } from 'workbox-routing';
import { outboxRecords, readCopy } from './lib/field/field-store';
import { flushOutbox, OUTBOX_SYNC_TAG } from './lib/field/outbox';
import { csrfCookieName } from './lib/api-client';

type WaitableEvent = Event & { waitUntil(work: Promise<unknown>): void };
type WorkerScope = {
  skipWaiting(): Promise<void>;
  addEventListener(type: 'message', listener: (event: MessageEvent) => void): void;
  addEventListener(type: 'sync', listener: (event: WaitableEvent & { tag: string }) => void): void;
};
type CookieStoreLike = { get(name: string): Promise<{ value: string } | null> };

declare global {
  // The build writes the precache list here (vite-plugin-pwa, injectManifest).
  interface Window {
    __WB_MANIFEST: (string | PrecacheEntry)[];
  }
}

const worker = self as unknown as WorkerScope;

precacheAndRoute(self.__WB_MANIFEST);
cleanupOutdatedCaches();
registerRoute(new NavigationRoute(createHandlerBoundToURL('/index.html'), { denylist: [/^\/api(\/|$)/, /^\/metrics/] }));

worker.addEventListener('message', (event) => {
  if ((event.data as { type?: string } | null)?.type === 'SKIP_WAITING') void worker.skipWaiting();
});

/** The double-submit token, read where a worker can: the Cookie Store API (browsers with Background Sync have it). */
async function csrfToken() {
  const store = (self as unknown as { cookieStore?: CookieStoreLike }).cookieStore;
  return (await store?.get(csrfCookieName))?.value;
}

worker.addEventListener('sync', (event) => {
  if (event.tag !== OUTBOX_SYNC_TAG) return;
  event.waitUntil(
    (async () => {
      const kept = await readCopy();
      if (!kept) return;
      await flushOutbox(kept.session.user.id, csrfToken);
      // Still no signal: failing the sync asks the browser to fire it again later.
      if ((await outboxRecords()).some((r) => r.state === 'waiting' && r.userId === kept.session.user.id)) throw new Error('Field records still waiting');
    })(),
  );
});
