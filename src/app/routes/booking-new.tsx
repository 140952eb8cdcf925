import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import { ArrowLeftIcon } from '../../components/icons';
import { LoadingPanel } from '../../components/loading-panel';
import { Notice } from '../../components/notice';
import { PageHeader } from '../../components/page-header';
import { useSession } from '../../features/auth/components/session-context';
import { BookForm } from '../../features/bookings/components/book-form';
import { useAsset } from '../../features/fleet/api/get-asset';
import { assetsQueryOptions } from '../../features/fleet/api/get-assets';
import { useKits } from '../../features/kits/api/get-kits';
import { useSiteJobs } from '../../features/site-jobs/api/get-site-jobs';
import { JobForm } from '../../features/site-jobs/components/job-form';
import { useStaff } from '../../features/users/api/get-staff';

const isDate = (s: string | null) => (s && /^\d{4}-\d{2}-\d{2}$/.test(s) ? s : undefined);

/** "Book kit": a kit or items, whole days, a job; problems explained before saving. */
export default function BookingNewRoute() {
  const { user } = useSession();
  const navigate = useNavigate();
  const [params] = useSearchParams();
  const kits = useKits();
  const jobs = useSiteJobs();
  // "Book this item" from an item's page starts with it on the list.
  const assetId = params.get('assetId') ?? '';
  const asset = useAsset(assetId);

  const staff = useStaff(['technician']);
  // A booking made from a job starts with the job's days unless the link names others.
  const jobId = params.get('jobId') ?? undefined;
  const job = jobs.data?.items.find((j) => j.id === jobId);
  const initial = {
    kitId: params.get('kitId') ?? undefined,
    items: asset.data ? [asset.data] : undefined,
    startsOn: isDate(params.get('startsOn')) ?? job?.startsOn,
    endsOn: isDate(params.get('endsOn')) ?? (isDate(params.get('startsOn')) ? undefined : job?.endsOn),
    jobId,
  };

  const error = kits.error ?? (assetId ? asset.error : null) ?? jobs.error;
  return (
    <>
      <Link to="/board" className="mb-2 inline-flex min-h-9 items-center gap-1 text-sm font-semibold text-brass-deep">
        <ArrowLeftIcon size={14} />
        Booking board
      </Link>
      <PageHeader
        title="Book kit"
        description="Reserve a kit or separate items for whole days. Nestkeeper checks every item against calibration, holds and other bookings as you choose."
      />
      {error ? <Notice tone="error">{error.message}</Notice> : null}
      {kits.isPending || (assetId && asset.isPending) || jobs.isPending ? (
        <LoadingPanel label="Loading kits and jobs…" />
      ) : kits.data && jobs.data ? (
        <div className="max-w-3xl">
          <BookForm
            kits={kits.data.items}
            fleet={assetsQueryOptions}
            jobs={jobs.data.items}
            initial={initial}
            onBooked={(booking) => navigate(`/bookings/${booking.id}`)}
            renderNewJob={({ startsOn, endsOn, onCreated, onCancel }) => (
              <JobForm
                me={{ id: user.id, name: user.name }}
                technicians={staff.data?.items ?? []}
                defaults={{ startsOn, endsOn }}
                onSaved={(job) => onCreated(job.id)}
                onCancel={onCancel}
                submitLabel="Add job"
              />
            )}
          />
        </div>
      ) : null}
    </>
  );
}
