import { Navigate } from 'react-router-dom';
import { Notice } from '../../components/notice';
import { RENTER_TOKEN_KEY } from '../../features/rentals/components/renter-page';
import { RenterFrame } from '../shell/renter-frame';

/** Where the payment provider sends the renter back: on to their rental's page when this browser came from it. */
export default function RenterReturnedRoute() {
  const token = sessionStorage.getItem(RENTER_TOKEN_KEY);
  if (token) return <Navigate to={`/renter/${encodeURIComponent(token)}`} replace />;
  return (
    <RenterFrame title="Back from the payment page">
      <Notice tone="info" title="Thank you">
        The deposit is being confirmed with the payment provider. You can close this page, or open the link in your e-mail again to see your rental.
      </Notice>
    </RenterFrame>
  );
}
