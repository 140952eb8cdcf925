import { StatusChip, type StatusTone } from '../../../components/status-chip';
import type { RoutineRunView } from '../../../../shared/routines/views';

const looks: Record<RoutineRunView['status'], { tone: StatusTone; label: string }> = {
  succeeded: { tone: 'ok', label: 'Succeeded' },
  failed: { tone: 'bad', label: 'Failed' },
  running: { tone: 'busy', label: 'Running' },
};

export function RoutineRunStatus({ run }: { run: RoutineRunView | null }) {
  if (!run) return <StatusChip tone="none" label="Never run" />;
  const look = looks[run.status] ?? { tone: 'info' as const, label: run.status };
  return <StatusChip tone={look.tone} label={look.label} />;
}
