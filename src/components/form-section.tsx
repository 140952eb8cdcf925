import type { ReactNode } from 'react';

/** One titled group of a long form's fields. */
export function FormSection({ legend, children }: { legend: string; children: ReactNode }) {
  return (
    <fieldset className="flex flex-col gap-3 rounded-lg border border-paper-line bg-card p-4">
      <legend className="px-1 font-semibold text-ink-900">{legend}</legend>
      {children}
    </fieldset>
  );
}
