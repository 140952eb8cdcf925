import { SpinnerIcon } from './icons';

export function LoadingPanel({ label = 'Loading…', className = '' }: { label?: string; className?: string }) {
  return (
    <div role="status" className={`flex items-center gap-2 py-6 text-ink-700 ${className}`}>
      <SpinnerIcon size={18} />
      <span>{label}</span>
    </div>
  );
}
