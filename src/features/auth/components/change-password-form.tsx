import { Form, Formik } from 'formik';
import { useState } from 'react';
import * as Yup from 'yup';
import { Button } from '../../../components/button';
import { Field } from '../../../components/field';
import { Notice } from '../../../components/notice';
import { applyServerErrors } from '../../../lib/form-errors';
import { MIN_PASSWORD_LENGTH, newPasswordSchema } from '../../../lib/passwords';
import { useChangePassword } from '../api/change-password';
import { useSession } from './session-context';

const schemaFor = (context: string[]) =>
  Yup.object({
    currentPassword: Yup.string().required('Enter the password you use now.'),
    newPassword: newPasswordSchema('Choose a new password.', () => context).notOneOf(
      [Yup.ref('currentPassword')],
      'The new password must differ from the current one.',
    ),
    repeatPassword: Yup.string()
      .required('Type the new password again.')
      .oneOf([Yup.ref('newPassword')], 'The two new passwords do not match.'),
  });

type Values = Yup.InferType<ReturnType<typeof schemaFor>>;

export function ChangePasswordForm() {
  const { user, organization } = useSession();
  const change = useChangePassword();
  const [problem, setProblem] = useState<string>();
  const [done, setDone] = useState(false);

  return (
    <Formik<Values>
      initialValues={{ currentPassword: '', newPassword: '', repeatPassword: '' }}
      validationSchema={schemaFor([user.email, user.name, organization.name])}
      onSubmit={async (values, helpers) => {
        setProblem(undefined);
        setDone(false);
        try {
          await change.mutateAsync({ currentPassword: values.currentPassword, newPassword: values.newPassword });
          helpers.resetForm();
          setDone(true);
        } catch (error) {
          setProblem(
            applyServerErrors(error, helpers, {
              fields: ['currentPassword', 'newPassword'],
              byCode: { wrong_password: 'currentPassword' },
            }),
          );
        }
      }}
    >
      {({ isSubmitting }) => (
        <Form noValidate className="flex max-w-md flex-col gap-4">
          {done ? <Notice tone="success" title="Your password has been changed." /> : null}
          {problem ? (
            <Notice tone="error" title="Password not changed">
              {problem}
            </Notice>
          ) : null}
          <Field name="currentPassword" label="Current password" type="password" autoComplete="current-password" />
          <Field
            name="newPassword"
            label="New password"
            type="password"
            autoComplete="new-password"
            hint={`At least ${MIN_PASSWORD_LENGTH} characters. A few unrelated words are easy to remember and hard to guess.`}
          />
          <Field name="repeatPassword" label="Repeat new password" type="password" autoComplete="new-password" />
          <div>
            <Button type="submit" variant="primary" busy={isSubmitting}>
              Change password
            </Button>
          </div>
        </Form>
      )}
    </Formik>
  );
}
