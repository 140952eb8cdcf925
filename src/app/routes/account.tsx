import { FactList, Panel } from '../../components/panel';
import { PageHeader } from '../../components/page-header';
import { ChangePasswordForm } from '../../features/auth/components/change-password-form';
import { SecondStepPanel } from '../../features/auth/components/second-step-panel';
import { SessionsPanel } from '../../features/auth/components/sessions-panel';
import { useSession } from '../../features/auth/components/session-context';
import { roleTitles } from '../../lib/roles';

export default function AccountRoute() {
  const { user, organization } = useSession();
  return (
    <>
      <PageHeader title="My account" description="Who you are in Nestkeeper, how you sign in, and where you are signed in now." />
      <div className="flex flex-col gap-5">
        <Panel title="You">
          <FactList
            items={[
              { term: 'Name', value: user.name },
              { term: 'E-mail (sign-in name)', value: user.email, mono: true },
              { term: 'Role', value: `${roleTitles[user.role]} at ${organization.name}` },
            ]}
          />
          <p className="mt-2 text-sm text-ink-700">Your firm’s owner changes names, e-mail addresses and roles.</p>
        </Panel>
        <Panel title="Password">
          <ChangePasswordForm />
        </Panel>
        <Panel title="Second step">
          <SecondStepPanel />
        </Panel>
        <Panel title="Where you are signed in">
          <SessionsPanel />
        </Panel>
      </div>
    </>
  );
}
