import type { FormikHelpers } from 'formik';
import { isApiError } from './api-client';

/**
 * Puts the server's per-field messages (ApiError.fieldErrors) back onto the
 * form's fields, and returns the message to show above the form (or undefined
 * when every problem landed on a field).
 *
 * `byCode` sends a whole error code to one field, e.g. `{ wrong_password: 'currentPassword' }`.
 */
export function applyServerErrors<Values>(
  error: unknown,
  helpers: Pick<FormikHelpers<Values>, 'setErrors'>,
  options: { fields: readonly (keyof Values & string)[]; byCode?: Record<string, keyof Values & string> },
): string | undefined {
  if (!isApiError(error)) return 'Something went wrong. Try again.';
  const errors: Record<string, string> = {};
  const codeField = options.byCode?.[error.code];
  if (codeField) errors[codeField] = error.message;
  let unplaced = false;
  for (const [field, message] of Object.entries(error.fieldErrors)) {
    if ((options.fields as readonly string[]).includes(field)) errors[field] = message;
    else unplaced = true;
  }
  if (Object.keys(errors).length) helpers.setErrors(errors as never);
  if (Object.keys(errors).length === 0 || unplaced) return error.message;
  return undefined;
}
