import { PageHeader } from '../../components/page-header';
import { JobsTable } from '../../features/jobs/components/jobs-table';

export default function JobsRoute() {
  return (
    <>
      <PageHeader
        title="Scheduled jobs"
        description="Work the server does on its own, such as the daily due-date scan. Each run happens once, however many servers are running."
      />
      <JobsTable />
    </>
  );
}
