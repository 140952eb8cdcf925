import type { ReactNode } from 'react';
import { useEffect, useId, useRef } from 'react';
import { CrossIcon } from './icons';

/**
 * A modal built on the native <dialog> element: the browser keeps focus inside,
 * Escape closes it, and focus returns to the opener afterwards.
 */
export function Dialog({
  open,
  onClose,
  title,
  description,
  children,
  size = 'md',
}: {
  size?: 'md' | 'lg';
  open: boolean;
  onClose: () => void;
  title: string;
  description?: ReactNode;
  children: ReactNode;
}) {
  const ref = useRef<HTMLDialogElement>(null);
  const titleId = useId();
  const descId = useId();

  useEffect(() => {
    const dialog = ref.current;
    if (!dialog) return;
    if (open && !dialog.open) dialog.showModal();
    if (!open && dialog.open) dialog.close();
  }, [open]);

  return (
    <dialog
      ref={ref}
      aria-labelledby={titleId}
      aria-describedby={description ? descId : undefined}
      onClose={onClose}
      onCancel={(e) => {
        e.preventDefault();
        onClose();
      }}
      className={`m-auto ${size === 'lg' ? 'w-[min(56rem,calc(100vw-1.5rem))]' : 'w-[min(32rem,calc(100vw-1.5rem))]'} rounded-lg border border-paper-line bg-card p-0 text-ink-900 shadow-xl`}
    >
      {open ? (
        <div className="p-5">
          <div className="mb-3 flex items-start justify-between gap-3">
            <h2 id={titleId} className="text-lg font-bold">
              {title}
            </h2>
            <button type="button" onClick={onClose} className="-m-1 rounded p-1 text-ink-700 hover:bg-paper-deep" aria-label="Close">
              <CrossIcon size={18} />
            </button>
          </div>
          {description ? (
            <div id={descId} className="mb-4 text-sm text-ink-700">
              {description}
            </div>
          ) : null}
          {children}
        </div>
      ) : null}
    </dialog>
  );
}
