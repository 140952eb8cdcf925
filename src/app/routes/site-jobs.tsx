import { useState } from 'react';
import { Link } from 'react-router-dom';
import { Button, buttonClasses } from '../../components/button';
import { Dialog } from '../../components/dialog';
import { PlusIcon } from '../../components/icons';
import { Notice } from '../../components/notice';
import { FactList } from '../../components/panel';
import { PageHeader } from '../../components/page-header';
import { useSession } from '../../features/auth/components/session-context';
import { useSiteJobs } from '../../features/site-jobs/api/get-site-jobs';
import type { SiteJobView } from '../../../shared/bookings/views';
import { JobForm } from '../../features/site-jobs/components/job-form';
import { useStaff } from '../../features/users/api/get-staff';
import { SiteJobsTable } from '../../features/site-jobs/components/site-jobs-table';
import { formatDateRange } from '../../lib/format';
import { can } from '../../lib/roles';

/** Customer site jobs: the list, and adding or changing one (owner and manager). */
export default function SiteJobsRoute() {
  const { user } = useSession();
  const jobs = useSiteJobs();
  const staff = useStaff(['technician']);
  const technicianName = (id: string | null) => staff.data?.items.find((p) => p.id === id)?.name;
  const canWrite = can(user.role, 'bookings.write');
  const [editing, setEditing] = useState<SiteJobView | 'new' | null>(null);
  const [saved, setSaved] = useState<string>();

  return (
    <>
      <PageHeader
        title="Jobs"
        description="Customer site jobs that kit is booked out to."
        actions={
          canWrite ? (
            <Button variant="primary" icon={<PlusIcon size={16} />} onClick={() => setEditing('new')}>
              New job
            </Button>
          ) : null
        }
      />
      {saved ? (
        <Notice tone="success" className="mb-3">
          {saved}
        </Notice>
      ) : null}
      {jobs.isError ? <Notice tone="error">{jobs.error.message}</Notice> : null}
      <SiteJobsTable jobs={jobs.data?.items} loading={jobs.isPending} onOpen={(job) => setEditing(job)} />
      <Dialog
        open={editing !== null}
        onClose={() => setEditing(null)}
        title={editing === 'new' ? 'New job' : editing ? `Job ${editing.reference}` : ''}
        size="lg"
      >
        {editing && editing !== 'new' && canWrite ? (
          <Link to={`/bookings/new?jobId=${editing.id}`} className={`${buttonClasses('secondary')} mb-3 self-start`}>
            Book kit for this job
          </Link>
        ) : null}
        {editing && canWrite ? (
          <JobForm
            job={editing === 'new' ? undefined : editing}
            me={{ id: user.id, name: user.name }}
            technicians={staff.data?.items ?? []}
            onSaved={(job) => {
              setSaved(`${job.reference} for ${job.customerName} is saved.`);
              setEditing(null);
            }}
            onCancel={() => setEditing(null)}
          />
        ) : editing && editing !== 'new' ? (
          <FactList
            items={[
              { term: 'Reference', value: editing.reference, mono: true },
              { term: 'Customer', value: editing.customerName },
              { term: 'Contact', value: editing.contactName },
              { term: 'E-mail', value: editing.contactEmail, mono: true },
              { term: 'Site address', value: editing.siteAddress },
              { term: 'On site', value: formatDateRange(editing.startsOn, editing.endsOn) },
              {
                term: 'Lead technician',
                value:
                  editing.leadTechnicianId === user.id
                    ? `You (${user.name})`
                    : editing.leadTechnicianId
                      ? (technicianName(editing.leadTechnicianId) ?? 'Another technician')
                      : null,
              },
              { term: 'Notes', value: editing.notes },
            ]}
          />
        ) : null}
      </Dialog>
    </>
  );
}
