import type { ReactNode } from 'react';
import { Wordmark } from './brand-mark';

/** The frame of the pages someone reaches before signing in (sign-in, forgotten password, a mailed link). */
export function PublicFrame({ title, lead, children, below }: { title: string; lead?: ReactNode; children: ReactNode; below?: ReactNode }) {
  return (
    <div className="flex min-h-dvh flex-col items-center justify-start bg-ink-900 px-4 pt-[12vh] pb-10 text-paper sm:justify-center sm:pt-10">
      <title>{`${title} · Nestkeeper`}</title>
      <div className="mb-6">
        <Wordmark size={40} />
      </div>
      <main className="w-full max-w-sm rounded-xl border-t-4 border-brass bg-card p-6 text-ink-900 shadow-2xl">
        <h1 className="mb-1 text-xl font-bold">{title}</h1>
        {lead ? <div className="mb-5 text-sm text-ink-700">{lead}</div> : null}
        {children}
      </main>
      {below ? <div className="on-ink mt-6 max-w-sm text-center text-sm text-ink-300">{below}</div> : null}
    </div>
  );
}
