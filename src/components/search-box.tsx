import { useId } from 'react';
import { SearchIcon } from './icons';

/** A labelled search input (the label is its accessible name). */
export function SearchBox({
  label,
  value,
  onChange,
  placeholder,
  className = '',
}: {
  label: string;
  value: string;
  onChange: (value: string) => void;
  placeholder?: string;
  className?: string;
}) {
  const id = useId();
  return (
    <div className={`flex flex-col gap-1 ${className}`}>
      <label htmlFor={id} className="text-sm font-semibold text-ink-800">
        {label}
      </label>
      <div className="relative">
        <SearchIcon size={16} className="pointer-events-none absolute top-1/2 left-3 -translate-y-1/2 text-ink-500" />
        <input
          id={id}
          type="search"
          value={value}
          onChange={(e) => onChange(e.target.value)}
          placeholder={placeholder}
          autoComplete="off"
          className="min-h-10 w-full rounded-md border border-paper-line bg-card pr-3 pl-9 text-base"
        />
      </div>
    </div>
  );
}
