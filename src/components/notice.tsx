import type { ReactNode } from 'react';
import { AlertIcon, CheckIcon, InfoIcon } from './icons';

export type NoticeTone = 'error' | 'success' | 'info' | 'caution';

const styles: Record<NoticeTone, { classes: string; icon: ReactNode }> = {
  error: { classes: 'border-bad/50 bg-bad-wash text-bad', icon: <AlertIcon size={18} /> },
  caution: { classes: 'border-warn/50 bg-warn-wash text-warn', icon: <AlertIcon size={18} /> },
  success: { classes: 'border-ok/40 bg-ok-wash text-ok', icon: <CheckIcon size={18} /> },
  info: { classes: 'border-info/40 bg-info-wash text-info', icon: <InfoIcon size={18} /> },
};

/** An inline message box. Errors are announced at once (role="alert"), the rest politely. */
export function Notice({ tone, title, children, className = '' }: { tone: NoticeTone; title?: ReactNode; children?: ReactNode; className?: string }) {
  const s = styles[tone];
  return (
    <div role={tone === 'error' ? 'alert' : 'status'} className={`flex items-start gap-2 rounded-md border px-3 py-2 ${s.classes} ${className}`}>
      <span className="mt-0.5 shrink-0">{s.icon}</span>
      <div className="min-w-0 text-ink-900">
        {title ? <p className="font-semibold">{title}</p> : null}
        {children ? <div className="text-sm">{children}</div> : null}
      </div>
    </div>
  );
}
