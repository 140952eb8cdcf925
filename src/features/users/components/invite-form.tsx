import { Form, Formik } from 'formik';
import { useState } from 'react';
import * as Yup from 'yup';
import { Button } from '../../../components/button';
import { Field, SelectField } from '../../../components/field';
import { Notice } from '../../../components/notice';
import { applyServerErrors } from '../../../lib/form-errors';
import { roles, type Role } from '../../../lib/roles';
import { useInviteUser } from '../api/invitations';
import { roleOptions } from './role-options';

const schema = Yup.object({
  email: Yup.string().trim().required('Enter the e-mail address they will sign in with.').email('That does not look like an e-mail address.'),
  role: Yup.string<Role>().oneOf(roles, 'Pick one of the listed roles.').required('Pick a role.'),
});

type Values = Yup.InferType<typeof schema>;

/** Invites a colleague by e-mail and role; they choose their own name and password from the mailed link. */
export function InviteForm() {
  const invite = useInviteUser();
  const [problem, setProblem] = useState<string>();
  const [sent, setSent] = useState<string>();

  return (
    <Formik<Values>
      initialValues={{ email: '', role: 'technician' }}
      validationSchema={schema}
      onSubmit={async (values, helpers) => {
        setProblem(undefined);
        setSent(undefined);
        try {
          const invitation = await invite.mutateAsync({ email: values.email.trim(), role: values.role });
          helpers.resetForm();
          setSent(`An invitation is on its way to ${invitation.email}. The link works once, for 72 hours.`);
        } catch (error) {
          setProblem(applyServerErrors(error, helpers, { fields: ['email', 'role'], byCode: { conflict: 'email' } }));
        }
      }}
    >
      {({ isSubmitting }) => (
        <Form noValidate aria-label="Invite someone" className="flex flex-col gap-4">
          {sent ? (
            <Notice tone="success" title="Invitation sent">
              {sent}
            </Notice>
          ) : null}
          {problem ? (
            <Notice tone="error" title="Not invited">
              {problem}
            </Notice>
          ) : null}
          <div className="grid gap-4 sm:grid-cols-2">
            <Field name="email" label="E-mail" type="email" autoComplete="off" mono />
            <SelectField name="role" label="Role" options={roleOptions} />
          </div>
          <p className="text-sm text-ink-700">
            They get a mail from Nestkeeper in your firm’s name and choose their own name and password. No password travels by mail.
          </p>
          <div>
            <Button type="submit" variant="primary" busy={isSubmitting}>
              Send invitation
            </Button>
          </div>
        </Form>
      )}
    </Formik>
  );
}
