import { useFormikContext } from 'formik';
import { Field } from './field';

/** "Starts on" and "Ends on" of a whole-day range (checked by `dayRangeRules`); the picker offers no last day before the first. */
export function DayRangeFields() {
  const { values } = useFormikContext<{ startsOn: string }>();
  return (
    <div className="grid gap-3 sm:grid-cols-2">
      <Field name="startsOn" label="Starts on" type="date" />
      <Field name="endsOn" label="Ends on" type="date" min={values.startsOn || undefined} />
    </div>
  );
}
