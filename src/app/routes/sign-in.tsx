import { Link, useNavigate } from 'react-router-dom';
import { PublicFrame } from '../../components/public-frame';
import { SignInForm } from '../../features/auth/components/sign-in-form';

export default function SignInRoute() {
  const navigate = useNavigate();
  return (
    <PublicFrame
      title="Sign in to Nestkeeper"
      lead="Use the e-mail address your firm registered for you."
      below={
        <Link to="/forgot-password" className="font-semibold text-paper underline">
          Forgot your password?
        </Link>
      }
    >
      <SignInForm onSignedIn={() => navigate('/', { replace: true })} />
    </PublicFrame>
  );
}
