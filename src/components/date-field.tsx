import { addYears, format, parse } from 'date-fns';
import { useField } from 'formik';
import { useEffect, useId, useRef, useState, type CSSProperties, type InputHTMLAttributes, type ReactNode } from 'react';
import { DayPicker, type Matcher } from 'react-day-picker';
import 'react-day-picker/style.css';
import { todayIn } from '../../shared/calibration/due-date';
import { isCalendarDate } from '../../shared/dates/calendar-date';
import { dateLocaleOf, parseTypedDate } from '../../shared/formatting/typed-date';
import { useFirmFormat } from '../lib/format';
import { controlClasses, FieldFrame, useVisibleError } from './field';
import { CalendarIcon } from './icons';

/** A calendar date as the day picker's local-midnight Date, and back. */
const asLocalDay = (isoDate: string) => parse(isoDate, 'yyyy-MM-dd', new Date(2000, 0, 1));
const asIsoDate = (day: Date) => format(day, 'yyyy-MM-dd');

/** The calendar in Nestkeeper's brass and ink; days large enough to tap. */
const calendarLook = {
  '--rdp-accent-color': 'var(--color-brass-deep)',
  '--rdp-accent-background-color': 'var(--color-brass-wash)',
  '--rdp-today-color': 'var(--color-brass-deep)',
  '--rdp-day-height': '2.5rem',
  '--rdp-day-width': '2.5rem',
  '--rdp-day_button-height': '2.4rem',
  '--rdp-day_button-width': '2.4rem',
} as CSSProperties;

export interface DateInputProps extends Omit<InputHTMLAttributes<HTMLInputElement>, 'value' | 'onChange' | 'type' | 'min' | 'max' | 'id'> {
  id: string;
  /** `YYYY-MM-DD`, '' when empty, or the text as typed while it is not a date yet. */
  value: string;
  onValueChange: (value: string) => void;
  /** First and last day the calendar offers (`YYYY-MM-DD`). */
  min?: string;
  max?: string;
  invalid?: boolean;
}

/**
 * A date typed or picked, shown in the firm's format ("3 Dec 2026"); the form gets an ISO calendar date. Typing accepts
 * the shown style, the locale's numeric style and `YYYY-MM-DD`; text that is no date yet is handed on as typed so the
 * form's own check can name the problem. The calendar is a pop-over of react-day-picker (arrow keys move by day).
 */
export function DateInput({ id, value, onValueChange, min, max, invalid = false, onBlur, className = '', disabled, ...rest }: DateInputProps) {
  const firm = useFirmFormat();
  const read = (text: string) => (text.trim() === '' ? '' : (parseTypedDate(text, firm.locale) ?? text));
  const shown = (v: string) => (isCalendarDate(v) ? firm.date(v) : v);
  const [text, setText] = useState(() => shown(value));
  const [open, setOpen] = useState(false);
  const wrapper = useRef<HTMLDivElement>(null);
  const opener = useRef<HTMLButtonElement>(null);
  const calendarId = useId();

  // A value set from outside (a reset, a suggested window, another locale) replaces the text unless the text already says it.
  useEffect(() => {
    setText((current) => (read(current) === value ? current : shown(value)));
  }, [value, firm]);

  useEffect(() => {
    if (!open) return;
    const closeOutside = (event: PointerEvent) => {
      if (!wrapper.current?.contains(event.target as Node)) setOpen(false);
    };
    document.addEventListener('pointerdown', closeOutside);
    return () => document.removeEventListener('pointerdown', closeOutside);
  }, [open]);

  const close = () => {
    setOpen(false);
    opener.current?.focus();
  };
  const today = asLocalDay(todayIn(firm.timeZone));
  const selected = isCalendarDate(value) ? asLocalDay(value) : undefined;
  const disabledDays: Matcher[] = [
    ...(min && isCalendarDate(min) ? [{ before: asLocalDay(min) }] : []),
    ...(max && isCalendarDate(max) ? [{ after: asLocalDay(max) }] : []),
  ];

  return (
    <div ref={wrapper} className={`relative flex gap-1 ${className}`}>
      <input
        id={id}
        type="text"
        inputMode="text"
        autoComplete="off"
        value={text}
        disabled={disabled}
        placeholder={`e.g. ${firm.date(todayIn(firm.timeZone))}`}
        aria-invalid={invalid || undefined}
        onChange={(event) => {
          setText(event.target.value);
          onValueChange(read(event.target.value));
        }}
        onBlur={(event) => {
          const iso = read(text);
          if (isCalendarDate(iso)) setText(firm.date(iso));
          onBlur?.(event);
        }}
        className={`${controlClasses} min-w-0 flex-1 ${invalid ? 'border-bad' : 'border-paper-line'}`}
        {...rest}
      />
      <button
        ref={opener}
        type="button"
        disabled={disabled}
        aria-label="Open calendar"
        aria-expanded={open}
        aria-controls={open ? calendarId : undefined}
        onClick={() => setOpen((was) => !was)}
        className="flex min-h-10 min-w-10 shrink-0 items-center justify-center rounded-md border border-paper-line bg-card text-ink-800 hover:bg-paper-deep disabled:opacity-55"
      >
        <CalendarIcon size={18} />
      </button>
      {open ? (
        <div
          id={calendarId}
          role="dialog"
          aria-label="Calendar"
          onKeyDown={(event) => {
            if (event.key !== 'Escape') return;
            event.stopPropagation();
            close();
          }}
          className="absolute top-full right-0 z-30 mt-1 max-w-[calc(100vw-1.5rem)] rounded-md border border-paper-line bg-card p-2 text-ink-900 shadow-lg"
        >
          <DayPicker
            mode="single"
            required
            autoFocus
            locale={dateLocaleOf(firm.locale)}
            today={today}
            selected={selected}
            defaultMonth={selected ?? (min && isCalendarDate(min) && asLocalDay(min) > today ? asLocalDay(min) : today)}
            captionLayout="dropdown"
            startMonth={addYears(today, -40)}
            endMonth={addYears(today, 15)}
            disabled={disabledDays}
            style={calendarLook}
            onSelect={(day) => {
              const iso = asIsoDate(day);
              setText(firm.date(iso));
              onValueChange(iso);
              close();
            }}
          />
        </div>
      ) : null}
    </div>
  );
}

export interface DateFieldProps extends Omit<DateInputProps, 'id' | 'value' | 'onValueChange' | 'name'> {
  /** Formik field name; its value is `YYYY-MM-DD` or ''. */
  name: string;
  label: ReactNode;
  hint?: ReactNode;
  id?: string;
}

/** A labelled Formik-bound date field in the firm's format, with its hint and error in plain words. */
export function DateField({ name, label, hint, id, className, ...rest }: DateFieldProps) {
  const autoId = useId();
  const inputId = id ?? `f-${name}-${autoId}`;
  const firm = useFirmFormat();
  const [field, , helpers] = useField<string>({
    name,
    // Text the field could not read as a date stops the form here; the form's own rules name every other problem.
    validate: (value) => (value && !isCalendarDate(value) ? `Enter a date such as ${firm.date(todayIn(firm.timeZone))}, or as YYYY-MM-DD.` : undefined),
  });
  const error = useVisibleError(name);
  const describedBy = error ? `${inputId}-error` : hint ? `${inputId}-hint` : undefined;
  return (
    <FieldFrame id={inputId} label={label} hint={hint} error={error} className={className}>
      <DateInput
        id={inputId}
        name={name}
        value={field.value ?? ''}
        onValueChange={(value) => void helpers.setValue(value)}
        onBlur={field.onBlur}
        invalid={Boolean(error)}
        aria-describedby={describedBy}
        {...rest}
      />
    </FieldFrame>
  );
}
