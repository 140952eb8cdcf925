import { useState } from 'react';
import { useNavigate } from 'react-router-dom';
import { Button } from '../../components/button';
import { PlusIcon } from '../../components/icons';
import { Notice } from '../../components/notice';
import { PageHeader } from '../../components/page-header';
import { useSession } from '../../features/auth/components/session-context';
import { useKits } from '../../features/kits/api/get-kits';
import { KitFormDialog } from '../../features/kits/components/kit-form-dialog';
import { KitsTable } from '../../features/kits/components/kits-table';
import { can } from '../../lib/roles';

export default function KitsRoute() {
  const { user } = useSession();
  const canWrite = can(user.role, 'fleet.write');
  const navigate = useNavigate();
  const kits = useKits();
  const [creating, setCreating] = useState(false);

  return (
    <>
      <PageHeader
        title="Kits"
        description="Sets of items that travel together. A kit is ready when every member is on the shelf and in calibration."
        actions={
          canWrite ? (
            <Button variant="primary" icon={<PlusIcon size={16} />} onClick={() => setCreating(true)}>
              New kit
            </Button>
          ) : null
        }
      />
      {kits.isError ? (
        <Notice tone="error" title="The kits could not be loaded">
          {kits.error.message}
        </Notice>
      ) : (
        <KitsTable kits={kits.data?.items} onOpen={(kit) => navigate(`/kits/${kit.id}`)} />
      )}
      {canWrite ? <KitFormDialog open={creating} onClose={() => setCreating(false)} onSaved={(kit) => navigate(`/kits/${kit.id}`)} /> : null}
    </>
  );
}
