import type { FormikHelpers } from 'formik';
import { useState } from 'react';
import { applyServerErrors } from '../../../lib/form-errors';
import { useUpdateSettings, type UpdateSettingsInput } from './update-settings';

type ErrorPlacement = Parameters<typeof applyServerErrors>[2];

/**
 * The save step every settings form shares: send one part of the settings,
 * then say it was saved, or put the server's complaints on the fields and
 * keep the rest as a message. Resolves to whether it was saved.
 */
export function useSettingsSave() {
  const update = useUpdateSettings();
  const [problem, setProblem] = useState<string>();
  const [saved, setSaved] = useState(false);
  async function save<Values>(input: UpdateSettingsInput, helpers: Pick<FormikHelpers<Values>, 'setErrors'>, placement: ErrorPlacement) {
    setProblem(undefined);
    setSaved(false);
    try {
      await update.mutateAsync(input);
      setSaved(true);
      return true;
    } catch (error) {
      setProblem(applyServerErrors(error, helpers, placement));
      return false;
    }
  }
  return { save, saved, problem };
}
