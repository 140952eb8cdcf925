import { Form, Formik } from 'formik';
import { useState } from 'react';
import * as Yup from 'yup';
import { Button } from '../../../components/button';
import { Field } from '../../../components/field';
import { Notice } from '../../../components/notice';
import { isApiError } from '../../../lib/api-client';
import { useSignIn, useSignInWithCode } from '../api/sign-in';

const passwordSchema = Yup.object({
  email: Yup.string().trim().required('Enter your e-mail address.').email('That does not look like an e-mail address.'),
  password: Yup.string().required('Enter your password.'),
});

const codeSchema = Yup.object({
  code: Yup.string()
    .required('Enter the 6 digits your app shows, or a recovery code.')
    .test(
      'shape',
      'Use the 6 digits your app shows, or a recovery code like ABCDE-FGHIJ.',
      (v) => !v || /^(\d{6}|[A-Za-z2-7]{10})$/.test(v.replace(/[\s-]/g, '')),
    ),
});

const problemOf = (error: unknown) => (isApiError(error) ? error.message : 'Something went wrong. Try again.');

/** E-mail and password; then, for someone with a second step, the code from their app. */
export function SignInForm({ onSignedIn }: { onSignedIn: () => void }) {
  const signIn = useSignIn();
  const withCode = useSignInWithCode();
  const [problem, setProblem] = useState<string>();
  const [ticket, setTicket] = useState<string>();

  if (ticket) {
    return (
      <Formik
        initialValues={{ code: '' }}
        validationSchema={codeSchema}
        onSubmit={async (values, helpers) => {
          setProblem(undefined);
          try {
            await withCode.mutateAsync({ ticket, code: values.code.trim() });
            onSignedIn();
          } catch (error) {
            setProblem(problemOf(error));
            helpers.setFieldValue('code', '', false);
            // A stale ticket (five minutes passed) needs the password again.
            if (isApiError(error) && /too long/.test(error.message)) setTicket(undefined);
          }
        }}
      >
        {({ isSubmitting }) => (
          <Form noValidate aria-label="Second step" className="flex flex-col gap-4">
            {problem ? (
              <Notice tone="error" title="Not signed in">
                {problem}
              </Notice>
            ) : null}
            <Field
              name="code"
              label="Code from your authenticator app"
              autoComplete="one-time-code"
              inputMode="text"
              mono
              required
              autoFocus
              hint="Lost your phone? Type one of your recovery codes instead; each works once."
            />
            <Button type="submit" variant="primary" busy={isSubmitting} className="w-full">
              Confirm and sign in
            </Button>
            <Button variant="quiet" onClick={() => setTicket(undefined)}>
              Start again
            </Button>
          </Form>
        )}
      </Formik>
    );
  }

  return (
    <Formik
      initialValues={{ email: '', password: '' }}
      validationSchema={passwordSchema}
      onSubmit={async (values, helpers) => {
        setProblem(undefined);
        try {
          const answer = await signIn.mutateAsync({ email: values.email.trim(), password: values.password });
          if ('secondStep' in answer) setTicket(answer.secondStep.ticket);
          else onSignedIn();
        } catch (error) {
          setProblem(problemOf(error));
          if (isApiError(error) && (error.status === 401 || error.status === 429)) helpers.setFieldValue('password', '', false);
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
