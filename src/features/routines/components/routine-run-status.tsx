import { StatusChip, type StatusTone } from '../../../components/status-chip';
import type { JobRun } from '../api/types';

const looks: Record<JobRun['status'], { tone: StatusTone; label: string }> = {
  succeeded: { tone: 'ok', label: 'Succeeded' },
  failed: { tone: 'bad', label: 'Failed' },
  running: { tone: 'busy', label: 'Running' },
};

export function RoutineRunStatus({ run }: { run: JobRun | null }) {
  if (!run) return <StatusChip tone="none" label="Never run" />;
  const look = looks[run.status] ?? { tone: 'info' as const, label: run.status };
  return <StatusChip tone={look.tone} label={look.label} />;
}
