import { useEffect, useRef, useState } from 'react';
import { Button } from '../../../components/button';
import { Notice } from '../../../components/notice';

/** The parts of the Barcode Detection API used here (not yet in TypeScript's DOM types). */
interface DetectedBarcode {
  rawValue: string;
}
interface BarcodeDetectorLike {
  detect(source: CanvasImageSource): Promise<DetectedBarcode[]>;
}
type BarcodeDetectorConstructor = new (options?: { formats?: string[] }) => BarcodeDetectorLike;

/** True when this browser can read QR codes from the camera. */
export function canScanQr(): boolean {
  return typeof window !== 'undefined' && 'BarcodeDetector' in window && !!navigator.mediaDevices?.getUserMedia;
}

/** The back camera, looking for a QR label; calls `onCode` once with what it read. */
export function QrScanner({ onCode, onClose }: { onCode: (code: string) => void; onClose: () => void }) {
  const videoRef = useRef<HTMLVideoElement>(null);
  const [problem, setProblem] = useState<string>();
  const onCodeRef = useRef(onCode);
  onCodeRef.current = onCode;

  useEffect(() => {
    let stream: MediaStream | undefined;
    let timer: number | undefined;
    let stopped = false;
    const Detector = (window as unknown as { BarcodeDetector: BarcodeDetectorConstructor }).BarcodeDetector;
    const detector = new Detector({ formats: ['qr_code'] });

    const look = async () => {
      const video = videoRef.current;
      if (stopped || !video) return;
      if (video.readyState >= 2) {
        try {
          const codes = await detector.detect(video);
          const code = codes.find((c) => c.rawValue)?.rawValue;
          if (code && !stopped) {
            stopped = true;
            onCodeRef.current(code);
            return;
          }
        } catch {
          // A frame that cannot be read; try the next one.
        }
      }
      timer = window.setTimeout(look, 200);
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
        void look();
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
