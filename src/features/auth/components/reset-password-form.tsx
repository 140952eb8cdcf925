import { Form, Formik } from 'formik';
import { useState } from 'react';
import { Link } from 'react-router-dom';
import * as Yup from 'yup';
import { Button } from '../../../components/button';
import { LoadingPanel } from '../../../components/loading-panel';
import { Notice } from '../../../components/notice';
import { applyServerErrors } from '../../../lib/form-errors';
import { useCompletePasswordReset, useResetLink } from '../api/password-reset';
import { LinkProblem } from './link-problem';
import { NewPasswordFields, newPasswordFields } from './new-password-fields';

/** A mailed reset link: choose a new password; every session of the person ends, then they sign in with it. */
export function ResetPasswordForm({ token }: { token: string }) {
  const link = useResetLink(token);
  const complete = useCompletePasswordReset();
  const [problem, setProblem] = useState<string>();
  const [done, setDone] = useState(false);

  if (done) {
    return (
      <div className="flex flex-col gap-4">
        <Notice tone="success" title="Your new password is set">
          Every device that was signed in has been signed out. Sign in with the new password now.
        </Notice>
        <Link to="/sign-in" className="font-semibold text-ink-900 underline">
          Go to sign-in
        </Link>
      </div>
    );
  }
  if (!token || link.isError) {
    return <LinkProblem error={link.error} title="This link does not work" next={{ to: '/forgot-password', label: 'Ask for a new link' }} />;
  }
  if (link.isPending) return <LoadingPanel label="Checking the link…" />;
  const email = link.data.email;
  return (
    <Formik
      initialValues={{ password: '', repeatPassword: '' }}
      validationSchema={Yup.object(newPasswordFields(() => [email]))}
      onSubmit={async (values, helpers) => {
        setProblem(undefined);
        try {
          await complete.mutateAsync({ token, password: values.password });
          setDone(true);
        } catch (error) {
          setProblem(applyServerErrors(error, helpers, { fields: ['password'] }));
        }
      }}
    >
      {({ isSubmitting }) => (
        <Form noValidate aria-label="Set a new password" className="flex flex-col gap-4">
          <p className="text-sm text-ink-700">
            For <span className="font-mono break-all">{email}</span>
          </p>
          {problem ? (
            <Notice tone="error" title="Password not set">
              {problem}
            </Notice>
          ) : null}
          <NewPasswordFields />
          <Button type="submit" variant="primary" busy={isSubmitting} className="w-full">
            Set new password
          </Button>
        </Form>
      )}
    </Formik>
  );
}
