import { getIn, useFormikContext } from 'formik';
import { AlertIcon } from './icons';

/** The error of a form field drawn by something other than <Field> (a list of chosen items, say). */
export function FieldMessage({ name }: { name: string }) {
  const { errors, touched, submitCount } = useFormikContext();
  const error: unknown = getIn(errors, name);
  if (typeof error !== 'string' || (!getIn(touched, name) && !submitCount)) return null;
  return (
    <p className="flex items-start gap-1 text-sm text-bad">
      <AlertIcon size={14} className="mt-0.5 shrink-0" />
      <span>{error}</span>
    </p>
  );
}
