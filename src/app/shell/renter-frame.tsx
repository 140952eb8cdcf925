import type { ReactNode } from 'react';

/** The renter's pages: the firm's name on top, no navigation (the renter is signed in nowhere), a narrow column that works on a phone. */
export function RenterFrame({ firm, title, children }: { firm?: string; title?: string; children: ReactNode }) {
  return (
    <div className="min-h-screen bg-paper">
      <header className="on-ink bg-ink-900 px-4 py-3 text-paper">
        <div className="mx-auto max-w-3xl">
          <p className="text-sm font-semibold text-brass-soft">{firm ?? 'Rental'}</p>
          {title ? <h1 className="text-xl font-bold">{title}</h1> : null}
        </div>
      </header>
      <main className="mx-auto max-w-3xl px-3 py-4 sm:px-4">{children}</main>
      <footer className="mx-auto max-w-3xl px-4 pb-6 text-xs text-ink-500">Rental records kept with Nestkeeper.</footer>
    </div>
  );
}
