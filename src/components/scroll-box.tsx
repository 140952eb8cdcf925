import type { ReactNode } from 'react';

/**
 * A table wider than a phone scrolls sideways inside this box, never the page: it is the containing block of what is
 * placed absolutely inside (a visually hidden caption or header would otherwise widen the page), and keyboard users can
 * focus it to scroll (WCAG 2.1.1; axe `scrollable-region-focusable`), so it is a named region.
 */
export function ScrollBox({ label, className = '', children }: { label: string; className?: string; children: ReactNode }) {
  return (
    <div
      role="region"
      aria-label={label}
      tabIndex={0}
      className={`relative overflow-x-auto focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-brass-deep ${className}`}
    >
      {children}
    </div>
  );
}
