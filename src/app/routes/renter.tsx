import { useParams } from 'react-router-dom';
import { LoadFailure } from '../../components/load-failure';
import { LoadingPanel } from '../../components/loading-panel';
import { useRenterRental } from '../../features/rentals/api/get-renter-rental';
import { RenterPage } from '../../features/rentals/components/renter-page';
import { adoptFirmVoice, FirmFormatContext } from '../../lib/format';
import { RenterFrame } from '../shell/renter-frame';

/** The renter's own page, opened from the link in their e-mail (no sign-in). */
export default function RenterRoute() {
  const { token = '' } = useParams();
  const view = useRenterRental(token);
  if (view.isPending)
    return (
      <RenterFrame>
        <LoadingPanel label="Opening your rental…" />
      </RenterFrame>
    );
  if (view.isError)
    return (
      <RenterFrame>
        <LoadFailure error={view.error} thing="rental" notFound="This link does not open a rental. Check that the whole link from the e-mail was used." />
      </RenterFrame>
    );
  // Outside the signed-in shell: the page takes the firm's voice from the rental itself.
  const { name, ...voice } = view.data.firm;
  return (
    <FirmFormatContext.Provider value={adoptFirmVoice(voice)}>
      <RenterFrame firm={name} title={`Rental ${view.data.number}`}>
        <RenterPage view={view.data} token={token} />
      </RenterFrame>
    </FirmFormatContext.Provider>
  );
}
