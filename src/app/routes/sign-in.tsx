import { useNavigate } from 'react-router-dom';
import { Wordmark } from '../../components/brand-mark';
import { SignInForm } from '../../features/auth/components/sign-in-form';

export default function SignInRoute() {
  const navigate = useNavigate();
  return (
    <div className="flex min-h-dvh flex-col items-center justify-start bg-ink-900 px-4 pt-[12vh] pb-10 text-paper sm:justify-center sm:pt-10">
      <title>Sign in · Nestkeeper</title>
      <div className="mb-6">
        <Wordmark size={40} />
      </div>
      <main className="w-full max-w-sm rounded-xl border-t-4 border-brass bg-card p-6 text-ink-900 shadow-2xl">
        <h1 className="mb-1 text-xl font-bold">Sign in to Nestkeeper</h1>
        <p className="mb-5 text-sm text-ink-700">Use the e-mail address your firm registered for you.</p>
        <SignInForm onSignedIn={() => navigate('/', { replace: true })} />
      </main>
      <p className="mt-6 max-w-sm text-center text-sm text-ink-300">Forgot your password? Ask your firm's owner to set a new one for you.</p>
    </div>
  );
}
