/**
 * The service worker (vite-plugin-pwa, Workbox) registered with workbox-window, prompt style: a new version waits
 * until the person chooses "Reload for the new version", so it is never swapped in under a half-written form.
 */
import { useSyncExternalStore } from 'react';
import { Workbox } from 'workbox-window';

let applyUpdate: (() => void) | null = null;
const listeners = new Set<() => void>();

export function registerAppWorker(): void {
  if (import.meta.env.DEV || !('serviceWorker' in navigator)) return;
  const wb = new Workbox('/sw.js', { scope: '/' });
  wb.addEventListener('waiting', () => {
    applyUpdate = () => {
      wb.addEventListener('controlling', () => window.location.reload());
      wb.messageSkipWaiting();
    };
    listeners.forEach((l) => l());
  });
  void wb.register();
  // A phone keeps the app open for days without a page load, when the browser would look for a new version itself:
  // look each time the person comes back to it (without signal the look fails quietly).
  document.addEventListener('visibilitychange', () => {
    if (document.visibilityState === 'visible') wb.update().catch(() => undefined);
  });
}

/** Null until a new version is installed and waiting; then the call that switches to it and reloads. */
export function useAppUpdate(): (() => void) | null {
  return useSyncExternalStore(
    (notify) => {
      listeners.add(notify);
      return () => listeners.delete(notify);
    },
    () => applyUpdate,
  );
}
