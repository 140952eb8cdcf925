import { useLocation } from 'react-router-dom';
import { PublicFrame } from '../../components/public-frame';
import { ResetPasswordForm } from '../../features/auth/components/reset-password-form';

/** The mailed link's secret rides after `#`, so it never reaches a server log. */
export default function ResetPasswordRoute() {
  const { hash } = useLocation();
  return (
    <PublicFrame title="Set a new password">
      <ResetPasswordForm token={hash.slice(1)} />
    </PublicFrame>
  );
}
