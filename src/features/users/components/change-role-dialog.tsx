import { Form, Formik } from 'formik';
import { useState } from 'react';
import * as Yup from 'yup';
import { Button } from '../../../components/button';
import { Dialog } from '../../../components/dialog';
import { SelectField } from '../../../components/field';
import { Notice } from '../../../components/notice';
import { applyServerErrors } from '../../../lib/form-errors';
import { roles, roleTitles, type Role } from '../../../lib/roles';
import { useUpdateUser } from '../api/update-user';
import type { UserView } from '../../../../shared/users/views';
import { roleOptions } from './role-options';

const schema = Yup.object({
  role: Yup.string<Role>().oneOf(roles, 'Pick one of the listed roles.').required('Pick a role.'),
});

export function ChangeRoleDialog({ user, onClose, onDone }: { user: UserView | null; onClose: () => void; onDone: (message: string) => void }) {
  const update = useUpdateUser();
  const [problem, setProblem] = useState<string>();

  return (
    <Dialog
      open={user !== null}
      onClose={() => {
        setProblem(undefined);
        onClose();
      }}
      title={user ? `Change role of ${user.name}` : 'Change role'}
      description="The role decides which pages and actions this person sees."
    >
      {user ? (
        <Formik<{ role: Role }>
          initialValues={{ role: user.role }}
          validationSchema={schema}
          onSubmit={async (values, helpers) => {
            setProblem(undefined);
            try {
              await update.mutateAsync({ id: user.id, role: values.role });
              onDone(`${user.name} is now ${roleTitles[values.role]}.`);
            } catch (error) {
              setProblem(applyServerErrors(error, helpers, { fields: ['role'] }));
            }
          }}
        >
          {({ isSubmitting, values }) => (
            <Form noValidate className="flex flex-col gap-4">
              {problem ? (
                <Notice tone="error" title="Role not changed">
                  {problem}
                </Notice>
              ) : null}
              <SelectField name="role" label="Role" options={roleOptions} />
              <div className="flex flex-wrap justify-end gap-2">
                <Button onClick={onClose}>Cancel</Button>
                <Button type="submit" variant="primary" busy={isSubmitting} disabled={values.role === user.role}>
                  Save role
                </Button>
              </div>
            </Form>
          )}
        </Formik>
      ) : null}
    </Dialog>
  );
}
