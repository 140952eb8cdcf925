import { useEffect, useRef, type ReactNode } from 'react';

/**
 * A small pop-over menu on the native <details> element (keyboard and screen
 * readers get a real disclosure button); it also closes on Escape and on a
 * click elsewhere.
 */
export function DropPanel({
  summary,
  children,
  align = 'left',
  className = '',
  summaryClassName = '',
}: {
  summary: ReactNode;
  children: ReactNode;
  align?: 'left' | 'right';
  className?: string;
  summaryClassName?: string;
}) {
  const ref = useRef<HTMLDetailsElement>(null);
  useEffect(() => {
    const close = (event: Event) => {
      const details = ref.current;
      if (!details?.open) return;
      if (event instanceof KeyboardEvent) {
        if (event.key !== 'Escape') return;
        details.open = false;
        details.querySelector('summary')?.focus();
        return;
      }
      if (!details.contains(event.target as Node)) details.open = false;
    };
    document.addEventListener('pointerdown', close);
    document.addEventListener('keydown', close);
    return () => {
      document.removeEventListener('pointerdown', close);
      document.removeEventListener('keydown', close);
    };
  }, []);
  return (
    <details ref={ref} className={`relative ${className}`}>
      <summary
        className={`flex cursor-pointer list-none items-center rounded-md border border-paper-line bg-card font-semibold hover:bg-paper-deep [&::-webkit-details-marker]:hidden ${summaryClassName}`}
      >
        {summary}
      </summary>
      {/* On a phone the panel spans the screen less a margin (a fixed box with no top stays where it would be), so it never sticks out. */}
      <div
        className={`absolute z-20 mt-1 rounded-md border border-paper-line bg-card p-2 shadow-lg ${align === 'right' ? 'right-0' : 'left-0'} max-sm:fixed max-sm:inset-x-3`}
      >
        {children}
      </div>
    </details>
  );
}
