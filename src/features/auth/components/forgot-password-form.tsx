import { Form, Formik } from 'formik';
import { useState } from 'react';
import * as Yup from 'yup';
import { Button } from '../../../components/button';
import { Field } from '../../../components/field';
import { Notice } from '../../../components/notice';
import { isApiError } from '../../../lib/api-client';
import { useRequestPasswordReset } from '../api/password-reset';

const schema = Yup.object({
  email: Yup.string().trim().required('Enter the e-mail address you sign in with.').email('That does not look like an e-mail address.'),
});

/** Asks for a reset link. The answer is the same for every address, so it never tells whether someone has an account. */
export function ForgotPasswordForm() {
  const request = useRequestPasswordReset();
  const [answer, setAnswer] = useState<string>();
  const [problem, setProblem] = useState<string>();

  if (answer) {
    return (
      <Notice tone="success" title="Check your mail">
        {answer} Nothing came? Look in the spam folder, or ask your firm’s owner.
      </Notice>
    );
  }
  return (
    <Formik
      initialValues={{ email: '' }}
      validationSchema={schema}
      onSubmit={async (values) => {
        setProblem(undefined);
        try {
          setAnswer((await request.mutateAsync(values.email.trim())).message);
        } catch (error) {
          setProblem(isApiError(error) ? error.message : 'Something went wrong. Try again.');
        }
      }}
    >
      {({ isSubmitting }) => (
        <Form noValidate aria-label="Forgotten password" className="flex flex-col gap-4">
          {problem ? (
            <Notice tone="error" title="Not sent">
              {problem}
            </Notice>
          ) : null}
          <Field name="email" label="E-mail" type="email" autoComplete="username" inputMode="email" mono required />
          <Button type="submit" variant="primary" busy={isSubmitting} className="w-full">
            Send me a link
          </Button>
        </Form>
      )}
    </Formik>
  );
}
