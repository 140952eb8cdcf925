import { Form, Formik } from 'formik';
import { useState } from 'react';
import * as Yup from 'yup';
import { Button } from '../../../components/button';
import { Field, SelectField } from '../../../components/field';
import { Notice } from '../../../components/notice';
import { applyServerErrors } from '../../../lib/form-errors';
import { MIN_PASSWORD_LENGTH, newPasswordSchema } from '../../../lib/passwords';
import { roles, type Role } from '../../../lib/roles';
import { useCreateUser } from '../api/create-user';
import { roleOptions } from './role-options';

const schemaFor = (firmName: string) =>
  Yup.object({
    name: Yup.string().trim().required('Enter the person’s name.').max(120, 'Keep the name under 120 characters.'),
    email: Yup.string().trim().required('Enter the e-mail address they will sign in with.').email('That does not look like an e-mail address.'),
    role: Yup.string<Role>().oneOf(roles, 'Pick one of the listed roles.').required('Pick a role.'),
    password: newPasswordSchema('Set a temporary password.', (v) => [v.email as string, v.name as string, firmName]),
  });

type Values = Yup.InferType<ReturnType<typeof schemaFor>>;

export function AddUserForm({ firmName }: { firmName: string }) {
  const create = useCreateUser();
  const [problem, setProblem] = useState<string>();
  const [added, setAdded] = useState<string>();

  return (
    <Formik<Values>
      initialValues={{ name: '', email: '', role: 'technician', password: '' }}
      validationSchema={schemaFor(firmName)}
      onSubmit={async (values, helpers) => {
        setProblem(undefined);
        setAdded(undefined);
        try {
          const user = await create.mutateAsync({
            name: values.name.trim(),
            email: values.email.trim(),
            role: values.role,
            password: values.password,
          });
          helpers.resetForm();
          setAdded(`${user.name} can now sign in with the temporary password you set. Ask them to change it under “My password”.`);
        } catch (error) {
          setProblem(
            applyServerErrors(error, helpers, {
              fields: ['name', 'email', 'role', 'password'],
              byCode: { conflict: 'email' },
            }),
          );
        }
      }}
    >
      {({ isSubmitting }) => (
        <Form noValidate aria-label="Add a user" className="flex flex-col gap-4">
          {added ? (
            <Notice tone="success" title="User added">
              {added}
            </Notice>
          ) : null}
          {problem ? (
            <Notice tone="error" title="User not added">
              {problem}
            </Notice>
          ) : null}
          <div className="grid gap-4 sm:grid-cols-2">
            <Field name="name" label="Name" autoComplete="off" />
            <Field name="email" label="E-mail" type="email" autoComplete="off" mono />
            <SelectField name="role" label="Role" options={roleOptions} />
            <Field
              name="password"
              label="Temporary password"
              type="password"
              autoComplete="new-password"
              hint={`At least ${MIN_PASSWORD_LENGTH} characters, not easy to guess. Tell them in person, not by e-mail.`}
            />
          </div>
          <div>
            <Button type="submit" variant="primary" busy={isSubmitting}>
              Add user
            </Button>
          </div>
        </Form>
      )}
    </Formik>
  );
}
