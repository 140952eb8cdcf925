import * as Yup from 'yup';
import { Field } from '../../../components/field';
import { MIN_PASSWORD_LENGTH, newPasswordSchema } from '../../../lib/passwords';

/** A new password typed twice, checked as the server checks it (the words a guesser tries first come from `context`). */
export const newPasswordFields = (context: (values: Record<string, unknown>) => (string | undefined)[]) => ({
  password: newPasswordSchema('Choose a password.', context),
  repeatPassword: Yup.string()
    .required('Type the password again.')
    .oneOf([Yup.ref('password')], 'The two passwords do not match.'),
});

export function NewPasswordFields() {
  return (
    <>
      <Field
        name="password"
        label="New password"
        type="password"
        autoComplete="new-password"
        hint={`At least ${MIN_PASSWORD_LENGTH} characters. A few unrelated words are easy to remember and hard to guess.`}
      />
      <Field name="repeatPassword" label="Repeat new password" type="password" autoComplete="new-password" />
    </>
  );
}
