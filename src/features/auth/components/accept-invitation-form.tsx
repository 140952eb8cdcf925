import { Form, Formik } from 'formik';
import { useState } from 'react';
import * as Yup from 'yup';
import { Button } from '../../../components/button';
import { Field } from '../../../components/field';
import { LoadingPanel } from '../../../components/loading-panel';
import { Notice } from '../../../components/notice';
import { applyServerErrors } from '../../../lib/form-errors';
import { roleTitles } from '../../../lib/roles';
import { useAcceptInvitation, useInvitationLink } from '../api/invitation-link';
import { LinkProblem } from './link-problem';
import { NewPasswordFields, newPasswordFields } from './new-password-fields';

/** A mailed invitation: the person names themselves and chooses a password, and is signed in. */
export function AcceptInvitationForm({ token, onJoined }: { token: string; onJoined: () => void }) {
  const link = useInvitationLink(token);
  const accept = useAcceptInvitation();
  const [problem, setProblem] = useState<string>();

  if (!token || link.isError) {
    return <LinkProblem error={link.error} title="This invitation does not work" next={{ to: '/sign-in', label: 'Go to sign-in' }} />;
  }
  if (link.isPending) return <LoadingPanel label="Checking the invitation…" />;
  const { email, role, firmName } = link.data;
  return (
    <Formik
      initialValues={{ name: '', password: '', repeatPassword: '' }}
      validationSchema={Yup.object({
        name: Yup.string().trim().required('Enter your name as colleagues know it.').max(120, 'Keep the name under 120 characters.'),
        ...newPasswordFields((v) => [email, v.name as string, firmName]),
      })}
      onSubmit={async (values, helpers) => {
        setProblem(undefined);
        try {
          await accept.mutateAsync({ token, name: values.name.trim(), password: values.password });
          onJoined();
        } catch (error) {
          setProblem(applyServerErrors(error, helpers, { fields: ['name', 'password'] }));
        }
      }}
    >
      {({ isSubmitting }) => (
        <Form noValidate aria-label="Accept the invitation" className="flex flex-col gap-4">
          <p className="text-sm text-ink-700">
            {firmName} invites you as <strong>{roleTitles[role]}</strong>. You will sign in as <span className="font-mono break-all">{email}</span>.
          </p>
          {problem ? (
            <Notice tone="error" title="Not joined yet">
              {problem}
            </Notice>
          ) : null}
          <Field name="name" label="Your name" autoComplete="name" />
          <NewPasswordFields />
          <Button type="submit" variant="primary" busy={isSubmitting} className="w-full">
            Join and sign in
          </Button>
        </Form>
      )}
    </Formik>
  );
}
