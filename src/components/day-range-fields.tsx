import { useFormikContext } from 'formik';
import { DateField } from './date-field';

/** "Starts on" and "Ends on" of a whole-day range (checked by `dayRangeRules`); the picker offers no last day before the first. */
export function DayRangeFields() {
  const { values } = useFormikContext<{ startsOn: string }>();
  return (
    <div className="grid gap-3 sm:grid-cols-2">
      <DateField name="startsOn" label="Starts on" />
      <DateField name="endsOn" label="Ends on" min={values.startsOn || undefined} />
    </div>
  );
}
