import { useId } from 'react';

/**
 * How far an upload has got: the words (with the percentage) and a bar. Once
 * every byte is sent the words say the server is still working, so a slow
 * save never looks finished.
 */
export function UploadProgress({ progress, sending, sent, large = false }: { progress: number; sending: string; sent: string; large?: boolean }) {
  const labelId = useId();
  const percent = Math.round(progress * 100);
  return (
    <div className="flex flex-col gap-1" role="status">
      <span id={labelId} className={large ? 'text-base font-semibold' : 'text-sm font-semibold'}>
        {progress < 1 ? `${sending} ${percent} %` : sent}
      </span>
      <div
        role="progressbar"
        aria-labelledby={labelId}
        aria-valuemin={0}
        aria-valuemax={100}
        aria-valuenow={percent}
        className={`w-full overflow-hidden rounded-full bg-card ${large ? 'h-4 border-2 border-ink-900' : 'h-3 border border-ink-700'}`}
      >
        <div className="h-full bg-ink-800 transition-[width]" style={{ width: `${percent}%` }} />
      </div>
    </div>
  );
}
