import { Link } from 'react-router-dom';
import { PublicFrame } from '../../components/public-frame';
import { ForgotPasswordForm } from '../../features/auth/components/forgot-password-form';

export default function ForgotPasswordRoute() {
  return (
    <PublicFrame
      title="Forgot your password?"
      lead="Give the e-mail address you sign in with. Nestkeeper mails a link to set a new password; it works once, within one hour."
      below={
        <Link to="/sign-in" className="font-semibold text-paper underline">
          Back to sign-in
        </Link>
      }
    >
      <ForgotPasswordForm />
    </PublicFrame>
  );
}
