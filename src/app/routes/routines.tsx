import { PageHeader } from '../../components/page-header';
import { RoutinesTable } from '../../features/routines/components/routines-table';

export default function RoutinesRoute() {
  return (
    <>
      <PageHeader
        title="Routines"
        description="Work the server does on its own, on a timetable, such as the daily due-date scan. Each run happens once, however many servers are running."
      />
      <RoutinesTable />
    </>
  );
}
