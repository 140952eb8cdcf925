import { expect, inject, vi } from 'vitest';

declare module 'vitest' {
  export interface ProvidedContext {
    /** From vitest.config.ts: how long a wait lasts (the test's timeout less a margin for reporting) and how often it looks. */
    patience: { waitMs: number; lookEveryMs: number };
  }
}

const { waitMs, lookEveryMs } = inject('patience');

/** How long a test waits for what a person would wait for; playwright's default timeouts too (tests/support/browser.ts). */
export const WAIT_MS = waitMs;

/** `expect.poll` with the suite's patience: `await eventually(() => page.locator('main').innerText()).toMatch(/Pass/)`. */
export const eventually = <T>(probe: () => T | Promise<T>) => expect.poll(probe, { timeout: waitMs, interval: lookEveryMs });

type Falsy = undefined | null | false | 0 | '';

/** The first truthy value `probe` gives within the suite's patience (a delivery, a mail in the sink); `what` names it if none comes. */
export async function waitUntil<T>(what: string, probe: () => T | Falsy | Promise<T | Falsy>): Promise<T> {
  try {
    return (await vi.waitUntil(probe, { timeout: waitMs, interval: lookEveryMs })) as T;
  } catch (err) {
    throw new Error(`Waited ${waitMs / 1000} s for ${what}; it did not come.`, { cause: err });
  }
}
