import type { ReactNode } from 'react';

/**
 * A home-screen panel: a heading with how many lines it has ("none" for zero), then the lines or the `empty` sentence.
 * `count` is left out while it is not known yet; `status` (loading, an error) sits under the heading meanwhile.
 */
export function CountedSection({
  id,
  title,
  count,
  empty,
  status,
  children,
  level = 2,
}: {
  id: string;
  title: string;
  count?: number;
  empty: string;
  status?: ReactNode;
  children: ReactNode;
  level?: 2 | 3;
}) {
  const Heading = level === 2 ? 'h2' : 'h3';
  return (
    <section aria-labelledby={id} className="rounded-lg border border-paper-line bg-card p-4">
      <div className="mb-2 flex items-baseline justify-between gap-2">
        <Heading id={id} className="text-base font-semibold text-ink-900">
          {title}
        </Heading>
        {count === undefined ? null : <span className="text-sm text-ink-700">{count === 0 ? 'none' : count}</span>}
      </div>
      {status}
      {count === 0 ? <p className="text-sm text-ink-700">{empty}</p> : <ul className="flex flex-col divide-y divide-paper-line">{children}</ul>}
    </section>
  );
}
