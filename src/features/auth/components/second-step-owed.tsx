import { useNavigate } from 'react-router-dom';
import { Wordmark } from '../../../components/brand-mark';
import { Button } from '../../../components/button';
import { useSignOut } from '../api/sign-out';
import { SecondStepSetup } from './second-step-setup';
import { useSession } from './session-context';

/** What someone sees, before anything else, when the firm requires a second step of their role and they have none yet. */
export function SecondStepOwed() {
  const { user, organization } = useSession();
  const navigate = useNavigate();
  const signOut = useSignOut({ onSignedOut: () => navigate('/sign-in', { replace: true }) });
  return (
    <div className="flex min-h-dvh flex-col bg-paper">
      <header className="on-ink flex h-14 items-center justify-between gap-3 bg-ink-900 px-3 text-paper sm:px-5">
        <Wordmark size={26} />
        <Button size="sm" variant="quiet" className="text-paper" onClick={() => signOut.mutate()}>
          Sign out
        </Button>
      </header>
      <main id="main" className="mx-auto w-full max-w-2xl px-3 py-6 sm:px-6">
        <title>Set up your second step · Nestkeeper</title>
        <h1 className="text-2xl font-bold tracking-tight">Set up your second step</h1>
        <p className="mt-1 mb-5 text-ink-700">
          {organization.name} requires owners and billing clerks to sign in with a code from a phone app as well as a password, because these roles move money.
          Set it up now, {user.name}; Nestkeeper opens as soon as it is on.
        </p>
        <section className="rounded-lg border border-paper-line bg-card p-4">
          <SecondStepSetup />
        </section>
      </main>
    </div>
  );
}
