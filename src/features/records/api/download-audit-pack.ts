import { useCallback, useRef, useState } from 'react';
import { ApiError, apiUrl } from '../../../lib/api-client';
import { packQuery } from './get-audit-pack-preview';
import type { AuditPackChoice } from './keys';

export type PackDownload =
  | { state: 'idle' }
  | { state: 'building'; receivedBytes: number; items: number | null }
  | { state: 'done'; receivedBytes: number; fileName: string }
  | { state: 'failed'; message: string };

async function failure(response: Response): Promise<string> {
  try {
    const body = (await response.json()) as { error?: { message?: string } };
    return body.error?.message ?? `The pack could not be built (HTTP ${response.status}).`;
  } catch {
    return `The pack could not be built (HTTP ${response.status}).`;
  }
}

/**
 * GET /api/audit-pack.zip read as a stream: the bytes received so far drive the progress, and the file is saved
 * once the server has sent the last one (a download cut short is reported, never saved as if whole).
 */
export function useAuditPackDownload() {
  const [status, setStatus] = useState<PackDownload>({ state: 'idle' });
  const abort = useRef<AbortController | null>(null);

  const start = useCallback(async (choice: AuditPackChoice) => {
    abort.current?.abort();
    const controller = new AbortController();
    abort.current = controller;
    setStatus({ state: 'building', receivedBytes: 0, items: null });
    try {
      const response = await fetch(apiUrl('/audit-pack.zip', packQuery(choice)), { credentials: 'include', signal: controller.signal });
      if (!response.ok || !response.body) return setStatus({ state: 'failed', message: await failure(response) });
      const items = Number(response.headers.get('X-Pack-Items') ?? 'NaN');
      const reader = response.body.getReader();
      const chunks: Uint8Array<ArrayBuffer>[] = [];
      let received = 0;
      for (;;) {
        const { done, value } = await reader.read();
        if (done) break;
        chunks.push(value);
        received += value.length;
        setStatus({ state: 'building', receivedBytes: received, items: Number.isFinite(items) ? items : null });
      }
      const fileName = /filename="([^"]+)"/.exec(response.headers.get('Content-Disposition') ?? '')?.[1] ?? 'audit-pack.zip';
      const url = URL.createObjectURL(new Blob(chunks, { type: 'application/zip' }));
      const link = document.createElement('a');
      link.href = url;
      link.download = fileName;
      link.click();
      setTimeout(() => URL.revokeObjectURL(url), 60_000);
      setStatus({ state: 'done', receivedBytes: received, fileName });
    } catch (err) {
      if (controller.signal.aborted) return setStatus({ state: 'idle' });
      setStatus({
        state: 'failed',
        message: err instanceof ApiError ? err.message : 'The download stopped before the pack was complete. Nothing was saved; try again.',
      });
    }
  }, []);

  const cancel = useCallback(() => abort.current?.abort(), []);
  return { status, start, cancel };
}
