import { useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import { Button, buttonClasses } from '../../components/button';
import { ArrowLeftIcon, PrintIcon } from '../../components/icons';
import { LoadFailure } from '../../components/load-failure';
import { LoadingPanel } from '../../components/loading-panel';
import { PageHeader } from '../../components/page-header';
import { HeavyCaseCaution } from '../../components/safety-cautions';
import { useSession } from '../../features/auth/components/session-context';
import { fleetKeys } from '../../features/fleet/api/keys';
import { useKit } from '../../features/kits/api/get-kit';
import { kitLabelsUrl } from '../../features/kits/api/get-kit-labels';
import { KitFormDialog } from '../../features/kits/components/kit-form-dialog';
import { KitMembers } from '../../features/kits/components/kit-members';
import { PackingList } from '../../features/kits/components/packing-list';
import { ReadinessSummary } from '../../features/kits/components/readiness';
import { ShippingSheetPanel } from '../../features/kits/components/shipping-sheet-panel';
import { Notice } from '../../components/notice';
import { useStoredCopy } from '../../features/field/api/get-field-copy';
import { CopyAge } from '../../features/field/components/copy-age';
import { FieldKitItems } from '../../features/field/components/field-kit';
import { useOnline } from '../../lib/field/use-field-state';
import { can } from '../../lib/roles';

/** A kit's page: from the server with signal, from this phone's field copy (the kit carried) without. */
export default function KitRoute() {
  const { id = '' } = useParams();
  return useOnline() ? <ServerKit id={id} /> : <FieldKit id={id} />;
}

function FieldKit({ id }: { id: string }) {
  const stored = useStoredCopy();
  if (stored.isPending) return <LoadingPanel label="Loading the kit…" />;
  const copy = stored.data?.copy;
  const booking = copy && [...copy.bookings.now, ...copy.bookings.next].find((b) => b.kitId === id);
  return (
    <>
      <PageHeader
        title={booking?.kit?.name ?? 'Not on this phone'}
        description={booking ? 'The kit as this phone keeps it for work without signal.' : undefined}
      />
      <div className="mb-3">
        <CopyAge />
      </div>
      {booking && copy ? (
        <section aria-labelledby="kit-items-heading" className="rounded-lg border border-paper-line bg-card p-4">
          <h2 id="kit-items-heading" className="mb-2 text-lg font-bold">
            {booking.assetIds.length} items
          </h2>
          <FieldKitItems items={copy.items.filter((i) => booking.assetIds.includes(i.id))} />
        </section>
      ) : (
        <Notice tone="info" title="No signal">
          Without signal this phone shows only the kit you carry now and next. Find signal to open other kits.
        </Notice>
      )}
    </>
  );
}

function ServerKit({ id }: { id: string }) {
  const { user, organization } = useSession();
  const canWrite = can(user.role, 'fleet.write');
  const kit = useKit(id);
  const [renaming, setRenaming] = useState(false);
  const queryClient = useQueryClient();

  if (kit.isPending) return <LoadingPanel label="Loading the kit…" />;
  if (kit.isError) return <LoadFailure error={kit.error} thing="kit" notFound="No kit of your firm has this address." />;
  const k = kit.data;
  const hasCase = k.members.some((m) => m.type === 'case' || m.type === 'tracker');

  return (
    <>
      <div className="print:hidden">
        <Link to="/kits" className="mb-2 inline-flex min-h-9 items-center gap-1 text-sm font-semibold text-brass-deep">
          <ArrowLeftIcon size={14} />
          Back to the kit list
        </Link>
        <PageHeader
          title={k.name}
          description={k.notes ?? undefined}
          actions={
            <>
              {canWrite ? <Button onClick={() => setRenaming(true)}>Rename</Button> : null}
              <Button icon={<PrintIcon size={16} />} onClick={() => window.print()} disabled={k.members.length === 0}>
                Packing list
              </Button>
              <a href={kitLabelsUrl(k.id)} target="_blank" rel="noopener" className={buttonClasses('secondary')}>
                Label sheet
              </a>
            </>
          }
        />
        <div className="flex flex-col gap-4">
          <ReadinessSummary readiness={k.readiness} memberCount={k.members.length} />
          <KitMembers kit={k} canWrite={canWrite} onMembersChanged={() => void queryClient.invalidateQueries({ queryKey: fleetKeys.all })} />
          {hasCase ? <HeavyCaseCaution /> : null}
          <ShippingSheetPanel kitId={k.id} />
        </div>
      </div>
      <PackingList kit={k} organizationName={organization.name} />
      {canWrite ? <KitFormDialog key={k.updatedAt} open={renaming} kit={k} onClose={() => setRenaming(false)} onSaved={() => setRenaming(false)} /> : null}
    </>
  );
}
