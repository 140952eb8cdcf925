import { useMemo, useState } from 'react';
import { Notice } from '../../../components/notice';
import { isApiError } from '../../../lib/api-client';
import { useClearSecondStep } from '../api/clear-second-step';
import { useUpdateUser } from '../api/update-user';
import { useUsers } from '../api/get-users';
import type { UserView } from '../../../../shared/users/views';
import { ChangeRoleDialog } from './change-role-dialog';
import { InvitationsList } from './invitations-list';
import { InviteForm } from './invite-form';
import { ResetPasswordDialog } from './reset-password-dialog';
import { UsersTable, type UserRowActions } from './users-table';

type Outcome = { tone: 'success' | 'error'; text: string } | null;

/** The owner's list of people in the firm, with role, enable/disable, password reset and clearing a lost second step; invitations. */
export function UsersAdmin({ currentUserId, firmName }: { currentUserId: string; firmName: string }) {
  const users = useUsers();
  const update = useUpdateUser();
  const clearSecondStep = useClearSecondStep();
  const [roleFor, setRoleFor] = useState<UserView | null>(null);
  const [passwordFor, setPasswordFor] = useState<UserView | null>(null);
  const [outcome, setOutcome] = useState<Outcome>(null);

  const busyUserId = update.isPending ? update.variables?.id : clearSecondStep.isPending ? clearSecondStep.variables : undefined;
  const failed = (error: Error) => setOutcome({ tone: 'error', text: isApiError(error) ? error.message : 'The change was not saved. Try again.' });

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
            onError: failed,
          },
        );
      },
      onClearSecondStep: (user) => {
        setOutcome(null);
        clearSecondStep.mutate(user.id, {
          onSuccess: () =>
            setOutcome({ tone: 'success', text: `${user.name}'s second step is cleared. They sign in with their password and can set it up again.` }),
          onError: failed,
        });
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
          <UsersTable users={users.data?.items} currentUserId={currentUserId} actions={actions} />
        )}
      </section>

      <section aria-labelledby="invite-heading" className="max-w-3xl rounded-lg border border-paper-line bg-card p-4">
        <h2 id="invite-heading" className="mb-3 text-lg font-bold">
          Invite someone
        </h2>
        <InviteForm />
      </section>

      <section aria-labelledby="invitations-heading" className="flex max-w-3xl flex-col gap-3">
        <h2 id="invitations-heading" className="text-lg font-bold">
          Invitations waiting for an answer
        </h2>
        <InvitationsList />
      </section>

      <ChangeRoleDialog user={roleFor} onClose={() => setRoleFor(null)} onDone={done} />
      <ResetPasswordDialog user={passwordFor} firmName={firmName} onClose={() => setPasswordFor(null)} onDone={done} />
    </div>
  );
}
