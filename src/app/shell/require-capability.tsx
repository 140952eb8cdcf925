import { Link, Outlet } from 'react-router-dom';
import { buttonClasses } from '../../components/button';
import { PageHeader } from '../../components/page-header';
import { useSession } from '../../features/auth/components/session-context';
import { can, roleTitles, type Capability } from '../../lib/roles';

/** Layout route: renders its child screens only for roles that hold `capability`. */
export function RequireCapability({ capability }: { capability: Capability }) {
  const { user } = useSession();
  if (can(user.role, capability)) return <Outlet />;
  return (
    <>
      <PageHeader
        title="Not available for your role"
        description={`This page is for other roles. You are signed in as ${roleTitles[user.role]}; ask the firm's owner if you need it.`}
      />
      <Link to="/" className={buttonClasses('primary')}>
        Go to my home page
      </Link>
    </>
  );
}
