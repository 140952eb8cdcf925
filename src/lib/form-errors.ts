import { setIn, type FormikErrors, type FormikHelpers } from 'formik';
import { isApiError } from './api-client';

/**
 * Puts the server's per-field messages (ApiError.fieldErrors) back onto the
 * form's fields, and returns the message to show above the form (or undefined
 * when every problem landed on a field).
 *
 * `fields` lists the form's field names; dotted paths (`specs.lengthMm`,
 * `calibration.intervalMonths`) land on nested Formik fields of the same path.
 * `byCode` sends a whole error code to one field, e.g. `{ wrong_password: 'currentPassword' }`.
 * `aliases` maps a server field name onto a differently named form field (`replacementValueMinor` → `replacementValue`).
 * `labels` words a server fragment such as "is required" as a sentence ("Asset tag is required.").
 */
export function applyServerErrors<Values>(
  error: unknown,
  helpers: Pick<FormikHelpers<Values>, 'setErrors'>,
  options: {
    fields: readonly string[];
    byCode?: Record<string, string>;
    labels?: Record<string, string>;
    aliases?: Record<string, string>;
  },
): string | undefined {
  if (!isApiError(error)) return 'Something went wrong. Try again.';
  let errors: FormikErrors<Values> = {};
  let placed = 0;
  const codeField = options.byCode?.[error.code];
  if (codeField && !error.fieldErrors[codeField]) {
    errors = setIn(errors, codeField, error.message);
    placed++;
  }
  let unplaced = false;
  for (const [serverField, message] of Object.entries(error.fieldErrors)) {
    const field = options.aliases?.[serverField] ?? serverField;
    if (options.fields.includes(field)) {
      errors = setIn(errors, field, sentence(message, options.labels?.[field]));
      placed++;
    } else unplaced = true;
  }
  if (placed) helpers.setErrors(errors);
  if (placed === 0 || unplaced) return error.message;
  return undefined;
}

function sentence(message: string, label: string | undefined): string {
  if (!label || !/^[a-z]/.test(message)) return message;
  return `${label} ${message}${/[.!?]$/.test(message) ? '' : '.'}`;
}
