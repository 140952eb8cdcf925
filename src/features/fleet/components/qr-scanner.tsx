import { useEffect, useRef, useState } from 'react';
import { Button } from '../../../components/button';
import { Notice } from '../../../components/notice';

/** Frames are scaled down to this width before decoding: plenty for a label held in the frame, and quick on a phone. */
const FRAME_WIDTH = 480;

/**
 * True when this browser can open a camera: it has the media API and lists at least one video input. Read once on
 * the page; where it is false the scan button is not drawn at all. No permission is asked for by this check.
 */
export async function hasCamera(): Promise<boolean> {
  if (typeof navigator === 'undefined' || !navigator.mediaDevices?.getUserMedia || !navigator.mediaDevices.enumerateDevices) return false;
  try {
    return (await navigator.mediaDevices.enumerateDevices()).some((d) => d.kind === 'videoinput');
  } catch {
    return false;
  }
}

/**
 * The back camera, looking for a QR label; calls `onCode` once with what it read. Frames are decoded with jsQR in a
 * Web Worker (qr-decode.worker.ts), so it works where the browser has no barcode detector (iOS Safari among them).
 */
export function QrScanner({ onCode, onClose }: { onCode: (code: string) => void; onClose: () => void }) {
  const videoRef = useRef<HTMLVideoElement>(null);
  const [problem, setProblem] = useState<string>();
  const onCodeRef = useRef(onCode);
  onCodeRef.current = onCode;

  useEffect(() => {
    let stream: MediaStream | undefined;
    let timer: number | undefined;
    let stopped = false;
    const worker = new Worker(new URL('./qr-decode.worker.ts', import.meta.url), { type: 'module' });
    const canvas = document.createElement('canvas');
    const context = canvas.getContext('2d', { willReadFrequently: true });

    const next = () => {
      if (!stopped) timer = window.setTimeout(look, 120);
    };
    worker.onmessage = (event: MessageEvent<string | null>) => {
      if (stopped) return;
      if (event.data) {
        stopped = true;
        onCodeRef.current(event.data);
        return;
      }
      next();
    };
    worker.onerror = () => next();

    const look = () => {
      const video = videoRef.current;
      if (stopped || !video || !context) return;
      if (video.readyState < 2 || !video.videoWidth) return next();
      const scale = Math.min(1, FRAME_WIDTH / video.videoWidth);
      canvas.width = Math.round(video.videoWidth * scale);
      canvas.height = Math.round(video.videoHeight * scale);
      context.drawImage(video, 0, 0, canvas.width, canvas.height);
      const { data, width, height } = context.getImageData(0, 0, canvas.width, canvas.height);
      worker.postMessage({ data, width, height }, [data.buffer]);
    };

    navigator.mediaDevices
      .getUserMedia({ video: { facingMode: 'environment' }, audio: false })
      .then((s) => {
        stream = s;
        if (stopped) return;
        const video = videoRef.current;
        if (!video) return;
        video.srcObject = s;
        void video.play().catch(() => undefined);
        look();
      })
      .catch((error: unknown) => {
        const denied = error instanceof DOMException && (error.name === 'NotAllowedError' || error.name === 'SecurityError');
        setProblem(
          denied
            ? 'The camera was not allowed. Allow it in the browser settings, or type the tag instead.'
            : 'No camera could be opened. Type the tag instead.',
        );
      });

    return () => {
      stopped = true;
      if (timer) window.clearTimeout(timer);
      worker.terminate();
      stream?.getTracks().forEach((t) => t.stop());
    };
  }, []);

  return (
    <div className="flex flex-col gap-3">
      {problem ? (
        <Notice tone="error" title="Camera not available">
          {problem}
        </Notice>
      ) : (
        <div className="relative overflow-hidden rounded-lg bg-ink-950">
          <video ref={videoRef} muted playsInline className="aspect-square w-full object-cover" aria-label="Camera view" />
          <div aria-hidden="true" className="pointer-events-none absolute inset-[18%] rounded-lg border-4 border-brass-soft/80" />
          <p role="status" className="absolute inset-x-0 bottom-0 bg-ink-950/70 px-3 py-2 text-center text-paper">
            Hold the label's QR code inside the frame.
          </p>
        </div>
      )}
      <Button onClick={onClose} className="min-h-12 text-lg">
        Stop the camera
      </Button>
    </div>
  );
}
