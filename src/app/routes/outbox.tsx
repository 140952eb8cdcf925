import { PageHeader } from '../../components/page-header';
import { useSession } from '../../features/auth/components/session-context';
import { CopyAge } from '../../features/field/components/copy-age';
import { OutboxList } from '../../features/field/components/outbox-list';

/** /outbox: the checks and damage reports written on this phone — sent, waiting for signal, or refused. */
export default function OutboxRoute() {
  const { user } = useSession();
  return (
    <>
      <PageHeader
        title="Records on this phone"
        description="Checks and damage reports are saved here first and sent by themselves when there is signal. A refused one waits for you to correct or discard it."
      />
      <div className="mb-3">
        <CopyAge />
      </div>
      <OutboxList userId={user.id} />
    </>
  );
}
