/// <reference lib="webworker" />
import { decodeQrFrame, type QrFrame } from './qr-frame';

/** Decodes camera frames off the main thread, so the page stays smooth on a phone: one frame in, its text (or null) out. */
self.onmessage = (event: MessageEvent<QrFrame>) => {
  self.postMessage(decodeQrFrame(event.data));
};
