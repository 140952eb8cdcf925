import { Form, Formik } from 'formik';
import { useState } from 'react';
import * as Yup from 'yup';
import { Button } from '../../../components/button';
import { Dialog } from '../../../components/dialog';
import { Field } from '../../../components/field';
import { Notice } from '../../../components/notice';
import { applyServerErrors } from '../../../lib/form-errors';
import { MIN_PASSWORD_LENGTH, newPasswordSchema } from '../../../lib/passwords';
import { useResetUserPassword } from '../api/reset-user-password';
import type { UserView } from '../../../../shared/users/views';

const schemaFor = (person: UserView, firmName: string) =>
  Yup.object({
    password: newPasswordSchema('Set a temporary password.', () => [person.email, person.name, firmName]),
    repeatPassword: Yup.string()
      .required('Type the temporary password again.')
      .oneOf([Yup.ref('password')], 'The two passwords do not match.'),
  });

type Values = Yup.InferType<ReturnType<typeof schemaFor>>;

export function ResetPasswordDialog({
  user,
  firmName,
  onClose,
  onDone,
}: {
  user: UserView | null;
  firmName: string;
  onClose: () => void;
  onDone: (message: string) => void;
}) {
  const reset = useResetUserPassword();
  const [problem, setProblem] = useState<string>();

  return (
    <Dialog
      open={user !== null}
      onClose={() => {
        setProblem(undefined);
        onClose();
      }}
      title={user ? `Reset password of ${user.name}` : 'Reset password'}
      description="Their old password stops working at once. Give them the new one in person and ask them to change it."
    >
      {user ? (
        <Formik<Values>
          initialValues={{ password: '', repeatPassword: '' }}
          validationSchema={schemaFor(user, firmName)}
          onSubmit={async (values, helpers) => {
            setProblem(undefined);
            try {
              await reset.mutateAsync({ id: user.id, password: values.password });
              onDone(`${user.name}’s password has been reset.`);
            } catch (error) {
              setProblem(applyServerErrors(error, helpers, { fields: ['password'] }));
            }
          }}
        >
          {({ isSubmitting }) => (
            <Form noValidate className="flex flex-col gap-4">
              {problem ? (
                <Notice tone="error" title="Password not reset">
                  {problem}
                </Notice>
              ) : null}
              <Field
                name="password"
                label="New temporary password"
                type="password"
                autoComplete="new-password"
                hint={`At least ${MIN_PASSWORD_LENGTH} characters, not easy to guess.`}
              />
              <Field name="repeatPassword" label="Repeat temporary password" type="password" autoComplete="new-password" />
              <div className="flex flex-wrap justify-end gap-2">
                <Button onClick={onClose}>Cancel</Button>
                <Button type="submit" variant="primary" busy={isSubmitting}>
                  Reset password
                </Button>
              </div>
            </Form>
          )}
        </Formik>
      ) : null}
    </Dialog>
  );
}
