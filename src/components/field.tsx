import { useField } from 'formik';
import type { InputHTMLAttributes, ReactNode, SelectHTMLAttributes } from 'react';
import { useId } from 'react';
import { AlertIcon } from './icons';

interface FieldFrameProps {
  id: string;
  label: ReactNode;
  hint?: ReactNode;
  error?: string;
  children: ReactNode;
  className?: string;
}

export function FieldFrame({ id, label, hint, error, children, className = '' }: FieldFrameProps) {
  return (
    <div className={`flex flex-col gap-1 ${className}`}>
      <label htmlFor={id} className="text-sm font-semibold text-ink-800">
        {label}
      </label>
      {children}
      {hint && !error ? (
        <p id={`${id}-hint`} className="text-sm text-ink-500">
          {hint}
        </p>
      ) : null}
      {error ? (
        <p id={`${id}-error`} className="flex items-start gap-1 text-sm text-bad">
          <AlertIcon size={14} className="mt-0.5 shrink-0" />
          <span>{error}</span>
        </p>
      ) : null}
    </div>
  );
}

export const controlClasses =
  'w-full min-h-10 rounded-md border bg-card px-3 py-1.5 text-base text-ink-900 ' +
  'placeholder:text-ink-500 focus:border-brass-deep focus:outline-2 focus:outline-offset-0 focus:outline-brass-deep';

/** Show an error once the person has touched or changed the field (so forms validate as you type). */
export function useVisibleError(name: string): string | undefined {
  const [, meta] = useField(name);
  const changed = meta.value !== meta.initialValue;
  return (meta.touched || changed) && meta.error ? meta.error : undefined;
}

export interface FieldProps extends Omit<InputHTMLAttributes<HTMLInputElement>, 'name' | 'id'> {
  /** Formik field name; also the key server field errors are mapped onto. */
  name: string;
  label: ReactNode;
  hint?: ReactNode;
  /** Use the mono face (serials, tags, e-mails, ids). */
  mono?: boolean;
  id?: string;
  className?: string;
}

/** A labelled Formik-bound input with its hint and its error in plain words. */
export function Field({ name, label, hint, mono = false, id, className, type = 'text', ...rest }: FieldProps) {
  const autoId = useId();
  const inputId = id ?? `f-${name}-${autoId}`;
  const [field] = useField(name);
  const error = useVisibleError(name);
  const describedBy = error ? `${inputId}-error` : hint ? `${inputId}-hint` : undefined;
  return (
    <FieldFrame id={inputId} label={label} hint={hint} error={error} className={className}>
      <input
        id={inputId}
        type={type}
        {...field}
        value={field.value ?? ''}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy}
        className={`${controlClasses} ${error ? 'border-bad' : 'border-paper-line'} ${mono ? 'font-mono text-[0.95rem]' : ''}`}
        {...rest}
      />
    </FieldFrame>
  );
}

export interface SelectFieldProps extends Omit<SelectHTMLAttributes<HTMLSelectElement>, 'name' | 'id'> {
  name: string;
  label: ReactNode;
  hint?: ReactNode;
  options: readonly { value: string; label: string }[];
  id?: string;
  className?: string;
}

export function SelectField({ name, label, hint, options, id, className, ...rest }: SelectFieldProps) {
  const autoId = useId();
  const selectId = id ?? `f-${name}-${autoId}`;
  const [field] = useField(name);
  const error = useVisibleError(name);
  const describedBy = error ? `${selectId}-error` : hint ? `${selectId}-hint` : undefined;
  return (
    <FieldFrame id={selectId} label={label} hint={hint} error={error} className={className}>
      <select
        id={selectId}
        {...field}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy}
        className={`${controlClasses} ${error ? 'border-bad' : 'border-paper-line'}`}
        {...rest}
      >
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
    </FieldFrame>
  );
}

export interface CheckboxFieldProps extends Omit<InputHTMLAttributes<HTMLInputElement>, 'name' | 'id' | 'type'> {
  /** Formik field name. A boolean field, or (with `value`) an array the value is added to and removed from. */
  name: string;
  label: ReactNode;
  value?: string;
  hint?: ReactNode;
  /** Show the field's error under this box (set on one box of a group, or leave to CheckboxGroup). */
  showError?: boolean;
  className?: string;
}

/** A labelled checkbox with a comfortable touch target. */
export function CheckboxField({ name, label, value, hint, showError = true, className = '', ...rest }: CheckboxFieldProps) {
  const autoId = useId();
  const inputId = `f-${name}-${value ?? ''}-${autoId}`;
  const [field] = useField({ name, type: 'checkbox', value });
  const error = useVisibleError(name);
  return (
    <div className={`flex flex-col gap-1 ${className}`}>
      <label htmlFor={inputId} className="flex min-h-10 cursor-pointer items-center gap-2 text-base text-ink-900">
        <input
          id={inputId}
          type="checkbox"
          {...field}
          value={value}
          aria-invalid={showError && error ? true : undefined}
          aria-describedby={showError && error ? `${inputId}-error` : hint ? `${inputId}-hint` : undefined}
          className="size-5 accent-brass-deep"
          {...rest}
        />
        <span>{label}</span>
      </label>
      {hint && !(showError && error) ? (
        <p id={`${inputId}-hint`} className="text-sm text-ink-500">
          {hint}
        </p>
      ) : null}
      {showError && error ? (
        <p id={`${inputId}-error`} className="flex items-start gap-1 text-sm text-bad">
          <AlertIcon size={14} className="mt-0.5 shrink-0" />
          <span>{error}</span>
        </p>
      ) : null}
    </div>
  );
}

/** A group of checkboxes bound to one array field, with one legend and one error. */
export function CheckboxGroup({
  name,
  legend,
  options,
  className = '',
}: {
  name: string;
  legend: ReactNode;
  options: readonly { value: string; label: string }[];
  className?: string;
}) {
  const error = useVisibleError(name);
  const errorId = useId();
  return (
    <fieldset className={`flex flex-col gap-1 ${className}`} aria-describedby={error ? errorId : undefined}>
      <legend className="text-sm font-semibold text-ink-800">{legend}</legend>
      <div className="flex flex-wrap gap-x-5">
        {options.map((o) => (
          <CheckboxField key={o.value} name={name} value={o.value} label={o.label} showError={false} />
        ))}
      </div>
      {error ? (
        <p id={errorId} className="flex items-start gap-1 text-sm text-bad">
          <AlertIcon size={14} className="mt-0.5 shrink-0" />
          <span>{error}</span>
        </p>
      ) : null}
    </fieldset>
  );
}
