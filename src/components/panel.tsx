import type { ReactNode } from 'react';

/** A term–value list for an item's facts. */
export function FactList({ items }: { items: { term: string; value: ReactNode; mono?: boolean }[] }) {
  return (
    <dl className="grid gap-x-6 gap-y-2 sm:grid-cols-[minmax(9rem,max-content)_1fr]">
      {items.map((item) => (
        <div key={item.term} className="contents">
          <dt className="text-sm font-semibold text-ink-700 sm:pt-0.5">{item.term}</dt>
          <dd className={`mb-2 min-w-0 break-words text-ink-900 sm:mb-0 ${item.mono ? 'font-mono text-[0.95rem]' : ''}`}>
            {item.value === null || item.value === undefined || item.value === '' ? '—' : item.value}
          </dd>
        </div>
      ))}
    </dl>
  );
}

/** A titled card section of a page. `actions` sit beside the title. */
export function Panel({
  title,
  children,
  id,
  actions,
  className = '',
}: {
  title: string;
  children: ReactNode;
  id?: string;
  actions?: ReactNode;
  className?: string;
}) {
  const headingId = id ?? `panel-${title.toLowerCase().replace(/[^a-z0-9]+/g, '-')}`;
  return (
    <section aria-labelledby={headingId} className={`rounded-lg border border-paper-line bg-card p-4 ${className}`}>
      <div className="mb-3 flex flex-wrap items-baseline justify-between gap-2">
        <h2 id={headingId} className="text-lg font-bold text-ink-900">
          {title}
        </h2>
        {actions ? <div className="flex flex-wrap gap-2">{actions}</div> : null}
      </div>
      {children}
    </section>
  );
}
