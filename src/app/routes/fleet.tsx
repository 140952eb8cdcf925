import { useQueryClient } from '@tanstack/react-query';
import { useCallback, useMemo, useState } from 'react';
import { useNavigate, useSearchParams } from 'react-router-dom';
import { Button, buttonClasses } from '../../components/button';
import { DownloadIcon, PlusIcon, UploadIcon } from '../../components/icons';
import { Notice } from '../../components/notice';
import { PageHeader } from '../../components/page-header';
import { useSession } from '../../features/auth/components/session-context';
import { exportAssetsUrl } from '../../features/fleet/api/export-assets';
import type { AssetFilter } from '../../features/fleet/api/keys';
import type { AssetView } from '../../../shared/assets/views';
import { FleetFilterBar } from '../../features/fleet/components/fleet-filter-bar';
import { FleetGrid } from '../../features/fleet/components/fleet-grid';
import { filterFromSearchParams, filterToSearchParams } from '../../features/fleet/components/filter-params';
import { ImportDialog } from '../../features/fleet/components/import-dialog';
import { useKits } from '../../features/kits/api/get-kits';
import { kitsKeys } from '../../features/kits/api/keys';
import { formatCount } from '../../lib/format';
import { can } from '../../lib/roles';

export default function FleetRoute() {
  const { user } = useSession();
  const canWrite = can(user.role, 'fleet.write');
  const navigate = useNavigate();
  const [searchParams, setSearchParams] = useSearchParams();
  // The filter lives in the address; a local copy answers clicks at once
  // (the address updates a moment later) and follows Back/Forward.
  const urlKey = searchParams.toString();
  const [filter, setFilterState] = useState<AssetFilter>(() => filterFromSearchParams(searchParams));
  const [seenUrlKey, setSeenUrlKey] = useState(urlKey);
  if (urlKey !== seenUrlKey) {
    setSeenUrlKey(urlKey);
    if (filterToSearchParams(filter).toString() !== urlKey) setFilterState(filterFromSearchParams(searchParams));
  }
  const kits = useKits();
  const kitOptions = useMemo(() => (kits.data?.items ?? []).map((k) => ({ value: k.id, label: k.name })), [kits.data]);
  const [total, setTotal] = useState<number | null>(null);
  const [importOpen, setImportOpen] = useState(false);
  const [imported, setImported] = useState<number | null>(null);
  const [refreshSignal, setRefreshSignal] = useState(0);
  const queryClient = useQueryClient();

  const setFilter = useCallback(
    (next: AssetFilter) => {
      setFilterState(next);
      setSearchParams(filterToSearchParams(next), { replace: true });
    },
    [setSearchParams],
  );
  const open = useCallback((asset: AssetView) => navigate(`/fleet/${asset.id}`), [navigate]);

  return (
    <>
      <PageHeader
        title="Fleet"
        description="Every item your firm owns: where it is, and whether its calibration holds."
        actions={
          <>
            <a href={exportAssetsUrl(filter)} className={buttonClasses('secondary')} download>
              <DownloadIcon size={16} />
              Export CSV
            </a>
            {canWrite ? (
              <>
                <Button icon={<UploadIcon size={16} />} onClick={() => setImportOpen(true)}>
                  Import CSV
                </Button>
                <Button variant="primary" icon={<PlusIcon size={16} />} onClick={() => navigate('/fleet/new')}>
                  Add asset
                </Button>
              </>
            ) : null}
          </>
        }
      />
      <div className="flex flex-col gap-3">
        {imported !== null ? (
          <Notice tone="success" title="Import finished">
            {formatCount(imported)} {imported === 1 ? 'asset was' : 'assets were'} added. The list below is up to date.
          </Notice>
        ) : null}
        <FleetFilterBar filter={filter} onChange={setFilter} kitOptions={kitOptions} />
        <p role="status" className="text-sm text-ink-700">
          {total === null ? 'Counting…' : `${formatCount(total)} ${total === 1 ? 'asset' : 'assets'}`}
        </p>
        <FleetGrid filter={filter} onOpen={open} onTotal={setTotal} refreshSignal={refreshSignal} />
      </div>
      {canWrite ? (
        <ImportDialog
          open={importOpen}
          onClose={() => setImportOpen(false)}
          onImported={(created) => {
            setImported(created);
            setRefreshSignal((n) => n + 1);
            // Rows may name kits: new kits and members show on the kit pages too.
            void queryClient.invalidateQueries({ queryKey: kitsKeys.all });
          }}
        />
      ) : null}
    </>
  );
}
