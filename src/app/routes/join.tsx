import { useLocation, useNavigate } from 'react-router-dom';
import { PublicFrame } from '../../components/public-frame';
import { AcceptInvitationForm } from '../../features/auth/components/accept-invitation-form';

/** The mailed invitation's secret rides after `#`, so it never reaches a server log. */
export default function JoinRoute() {
  const { hash } = useLocation();
  const navigate = useNavigate();
  return (
    <PublicFrame title="Join your firm on Nestkeeper" lead="Choose the name colleagues see and the password you will sign in with.">
      <AcceptInvitationForm token={hash.slice(1)} onJoined={() => navigate('/', { replace: true })} />
    </PublicFrame>
  );
}
