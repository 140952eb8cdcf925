import { PageHeader } from '../../components/page-header';
import { ChangePasswordForm } from '../../features/auth/components/change-password-form';

export default function AccountPasswordRoute() {
  return (
    <>
      <PageHeader title="My password" description="Change the password you sign in with." />
      <ChangePasswordForm />
    </>
  );
}
