import { chromium } from 'playwright-core';

/** Debian's Chromium, headless, driven by playwright-core (each launch gets a fresh, throwaway user-data directory). */
export const launchChromium = () =>
  chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    args: [
      '--headless',
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
