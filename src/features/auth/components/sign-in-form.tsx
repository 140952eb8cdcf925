import { Form, Formik } from 'formik';
import { useState } from 'react';
import * as Yup from 'yup';
import { Button } from '../../../components/button';
import { Field } from '../../../components/field';
import { Notice } from '../../../components/notice';
import { isApiError } from '../../../lib/api-client';
import { useSignIn } from '../api/sign-in';

const schema = Yup.object({
  email: Yup.string().trim().required('Enter your e-mail address.').email('That does not look like an e-mail address.'),
  password: Yup.string().required('Enter your password.'),
});

type Values = Yup.InferType<typeof schema>;

export function SignInForm({ onSignedIn }: { onSignedIn: () => void }) {
  const signIn = useSignIn();
  const [problem, setProblem] = useState<string>();

  return (
    <Formik<Values>
      initialValues={{ email: '', password: '' }}
      validationSchema={schema}
      onSubmit={async (values, helpers) => {
        setProblem(undefined);
        try {
          await signIn.mutateAsync({ email: values.email.trim(), password: values.password });
          onSignedIn();
        } catch (error) {
          if (isApiError(error) && (error.status === 401 || error.status === 429)) {
            setProblem(error.message);
            helpers.setFieldValue('password', '', false);
          } else if (isApiError(error)) {
            setProblem(error.message);
          } else {
            setProblem('Something went wrong. Try again.');
          }
        }
      }}
    >
      {({ isSubmitting }) => (
        <Form noValidate className="flex flex-col gap-4">
          {problem ? (
            <Notice tone="error" title="Not signed in">
              {problem}
            </Notice>
          ) : null}
          <Field name="email" label="E-mail" type="email" autoComplete="username" inputMode="email" mono required />
          <Field name="password" label="Password" type="password" autoComplete="current-password" required />
          <Button type="submit" variant="primary" busy={isSubmitting} className="w-full">
            Sign in
          </Button>
        </Form>
      )}
    </Formik>
  );
}
