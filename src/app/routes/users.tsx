import { PageHeader } from '../../components/page-header';
import { useSession } from '../../features/auth/components/session-context';
import { UsersAdmin } from '../../features/users/components/users-admin';

export default function UsersRoute() {
  const { user, organization } = useSession();
  return (
    <>
      <PageHeader title="Users" description="Everyone who can sign in to your firm's Nestkeeper, and what their role lets them do." />
      <UsersAdmin currentUserId={user.id} firmName={organization.name} />
    </>
  );
}
