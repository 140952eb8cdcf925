import { useField } from 'formik';

/**
 * A compact numeric input for a table cell. Its label is the accessible name
 * (the column header says the same to sighted readers); its error shows under it.
 */
export function NumberCell({ name, label }: { name: string; label: string }) {
  const [field, meta] = useField<string>(name);
  const shown = (meta.touched || meta.value !== meta.initialValue) && meta.error ? meta.error : undefined;
  const errorId = `${name.replace(/\W/g, '-')}-error`;
  return (
    <div className="flex flex-col gap-0.5">
      <input
        {...field}
        value={field.value ?? ''}
        aria-label={label}
        aria-invalid={shown ? true : undefined}
        aria-describedby={shown ? errorId : undefined}
        inputMode="decimal"
        autoComplete="off"
        spellCheck={false}
        className={`min-h-10 w-full min-w-0 rounded-md border bg-card px-1 py-1 font-mono text-[0.8rem] sm:px-2 sm:text-[0.95rem] text-ink-900 focus:border-brass-deep focus:outline-2 focus:outline-brass-deep ${
          shown ? 'border-bad' : 'border-paper-line'
        }`}
      />
      {shown ? (
        <span id={errorId} className="text-xs text-bad">
          {shown}
        </span>
      ) : null}
    </div>
  );
}
