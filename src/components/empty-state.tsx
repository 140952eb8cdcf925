import type { ReactNode } from 'react';

/** An honest "nothing here yet" panel: says what will appear and, if possible, how to get there. */
export function EmptyState({
  title,
  children,
  action,
  icon,
  headingLevel = 2,
  className = '',
}: {
  title: string;
  children?: ReactNode;
  action?: ReactNode;
  icon?: ReactNode;
  headingLevel?: 2 | 3;
  className?: string;
}) {
  const Heading = headingLevel === 2 ? 'h2' : 'h3';
  return (
    <section className={`rounded-lg border border-dashed border-paper-line bg-card/70 px-4 py-5 ${className}`}>
      <div className="flex items-start gap-3">
        {icon ? <span className="mt-0.5 text-brass-deep">{icon}</span> : null}
        <div className="min-w-0 flex-1">
          <Heading className="text-base font-semibold text-ink-900">{title}</Heading>
          {children ? <div className="mt-1 text-sm text-ink-700">{children}</div> : null}
          {action ? <div className="mt-3">{action}</div> : null}
        </div>
      </div>
    </section>
  );
}
