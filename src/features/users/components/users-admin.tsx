import { useMemo, useState } from 'react';
import { Notice } from '../../../components/notice';
import { isApiError } from '../../../lib/api-client';
import { useDateFormat } from '../../../lib/format';
import { useUpdateUser } from '../api/update-user';
import { useUsers } from '../api/get-users';
import type { UserView } from '../../../../shared/users/views';
import { AddUserForm } from './add-user-form';
import { ChangeRoleDialog } from './change-role-dialog';
import { ResetPasswordDialog } from './reset-password-dialog';
import { UsersTable, type UserRowActions } from './users-table';

type Outcome = { tone: 'success' | 'error'; text: string } | null;

/** The owner's list of people in the firm, with role, enable/disable and password reset. */
export function UsersAdmin({ currentUserId, firmName }: { currentUserId: string; firmName: string }) {
  const users = useUsers();
  const update = useUpdateUser();
  const { timeZone } = useDateFormat();
  const [roleFor, setRoleFor] = useState<UserView | null>(null);
  const [passwordFor, setPasswordFor] = useState<UserView | null>(null);
  const [outcome, setOutcome] = useState<Outcome>(null);

  const busyUserId = update.isPending ? update.variables?.id : undefined;

  const actions = useMemo<UserRowActions>(
    () => ({
      onChangeRole: (user) => {
        setOutcome(null);
        setRoleFor(user);
      },
      onResetPassword: (user) => {
        setOutcome(null);
        setPasswordFor(user);
      },
      onToggleDisabled: (user) => {
        setOutcome(null);
        const disabled = !user.disabled;
        update.mutate(
          { id: user.id, disabled },
          {
            onSuccess: () =>
              setOutcome({
                tone: 'success',
                text: disabled ? `${user.name} is disabled and can no longer sign in.` : `${user.name} is enabled and can sign in again.`,
              }),
            onError: (error) =>
              setOutcome({
                tone: 'error',
                text: isApiError(error) ? error.message : 'The change was not saved. Try again.',
              }),
          },
        );
      },
      busyUserId,
    }),
    // `update.mutate` is stable; busyUserId changes re-render the buttons.
    [busyUserId],
  );

  const done = (text: string) => {
    setRoleFor(null);
    setPasswordFor(null);
    setOutcome({ tone: 'success', text });
  };

  return (
    <div className="flex flex-col gap-8">
      <section aria-labelledby="users-list-heading" className="flex flex-col gap-3">
        <h2 id="users-list-heading" className="text-lg font-bold">
          People in your firm
          {users.data ? <span className="ml-2 text-base font-normal text-ink-500">({users.data.total})</span> : null}
        </h2>
        {outcome ? <Notice tone={outcome.tone}>{outcome.text}</Notice> : null}
        {users.isError ? (
          <Notice tone="error" title="The user list could not be loaded">
            {users.error.message}
          </Notice>
        ) : (
          <UsersTable users={users.data?.items} currentUserId={currentUserId} timeZone={timeZone} actions={actions} />
        )}
      </section>

      <section aria-labelledby="add-user-heading" className="max-w-3xl rounded-lg border border-paper-line bg-card p-4">
        <h2 id="add-user-heading" className="mb-3 text-lg font-bold">
          Add a user
        </h2>
        <AddUserForm firmName={firmName} />
      </section>

      <ChangeRoleDialog user={roleFor} onClose={() => setRoleFor(null)} onDone={done} />
      <ResetPasswordDialog user={passwordFor} firmName={firmName} onClose={() => setPasswordFor(null)} onDone={done} />
    </div>
  );
}
