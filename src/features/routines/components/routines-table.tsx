import { useState } from 'react';
import { Button } from '../../../components/button';
import { EmptyState } from '../../../components/empty-state';
import { LoadingPanel } from '../../../components/loading-panel';
import { Notice } from '../../../components/notice';
import { isApiError } from '../../../lib/api-client';
import { useFirmFormat } from '../../../lib/format';
import { useRoutines } from '../api/get-routines';
import { useRunRoutine } from '../api/run-routine';
import type { RoutineRunView, RoutineView } from '../../../../shared/routines/views';
import { RoutineRunStatus } from './routine-run-status';
import { ScrollBox } from '../../../components/scroll-box';

type RunOutcome = { run?: RoutineRunView; error?: string };

/** Routines, their last run, and a "Run now" per routine. Few rows, so a plain table. */
export function RoutinesTable() {
  const routines = useRoutines();
  const runRoutine = useRunRoutine();
  const [outcomes, setOutcomes] = useState<Record<string, RunOutcome>>({});
  const fmt = useFirmFormat();

  if (routines.isPending) return <LoadingPanel label="Loading routines…" />;
  if (routines.isError) {
    return (
      <Notice tone="error" title="The routines could not be loaded">
        {routines.error.message}
      </Notice>
    );
  }
  if (routines.data.items.length === 0) {
    return <EmptyState title="No routines">The server has no routines registered.</EmptyState>;
  }

  const runNow = (routine: RoutineView) => {
    setOutcomes((o) => ({ ...o, [routine.name]: {} }));
    runRoutine.mutate(routine.name, {
      onSuccess: ({ run }) => setOutcomes((o) => ({ ...o, [routine.name]: { run } })),
      onError: (error) =>
        setOutcomes((o) => ({
          ...o,
          [routine.name]: { error: isApiError(error) ? error.message : 'The routine could not be started.' },
        })),
    });
  };

  return (
    <ScrollBox label="Routines" className="rounded-lg border border-paper-line bg-card">
      <table className="w-full min-w-[40rem] border-collapse text-left">
        <caption className="sr-only">Routines and their last run</caption>
        <thead className="bg-paper-deep text-sm">
          <tr>
            <th scope="col" className="px-3 py-2 font-semibold">
              Routine
            </th>
            <th scope="col" className="px-3 py-2 font-semibold">
              Schedule
            </th>
            <th scope="col" className="px-3 py-2 font-semibold">
              Last run
            </th>
            <th scope="col" className="px-3 py-2 font-semibold">
              <span className="sr-only">Actions</span>
            </th>
          </tr>
        </thead>
        <tbody className="divide-y divide-paper-line">
          {routines.data.items.map((routine) => {
            const outcome = outcomes[routine.name];
            const running = runRoutine.isPending && runRoutine.variables === routine.name;
            const last = routine.lastRun;
            return (
              <tr key={routine.name} className="align-top">
                <th scope="row" className="px-3 py-3 font-normal">
                  <span className="block font-mono text-sm font-semibold">{routine.name}</span>
                  <span className="block text-sm text-ink-700">{routine.description}</span>
                </th>
                <td className="px-3 py-3">
                  <code className="rounded bg-paper-deep px-1.5 py-0.5 text-sm">{routine.schedule}</code>
                </td>
                <td className="px-3 py-3 text-sm">
                  <div className="flex flex-col items-start gap-1">
                    <RoutineRunStatus run={last} />
                    {last ? (
                      <>
                        <span className="text-ink-700">
                          Started <time dateTime={last.startedAt}>{fmt.dateTime(last.startedAt)}</time>
                          {last.finishedAt ? (
                            <>
                              , finished <time dateTime={last.finishedAt}>{fmt.dateTime(last.finishedAt)}</time>
                            </>
                          ) : null}
                        </span>
                        <span className="text-ink-700">
                          {last.scope === 'every firm'
                            ? 'Scheduled run over every firm'
                            : `Run now for your firm${last.summary ? `: ${summaryWords(last.summary)}` : ''}`}
                        </span>
                        {last.error ? <span className="text-bad">{last.error}</span> : null}
                      </>
                    ) : null}
                  </div>
                </td>
                <td className="px-3 py-3">
                  <div className="flex flex-col items-end gap-2">
                    <Button size="sm" variant="primary" busy={running} onClick={() => runNow(routine)}>
                      Run now
                    </Button>
                  </div>
                  {outcome && (outcome.run || outcome.error) ? <RunOutcomeNote outcome={outcome} /> : null}
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </ScrollBox>
  );
}

function RunOutcomeNote({ outcome }: { outcome: RunOutcome }) {
  if (outcome.error) {
    return (
      <Notice tone="error" className="mt-2 max-w-xs">
        {outcome.error}
      </Notice>
    );
  }
  const run = outcome.run!;
  const tone = run.status === 'failed' ? 'error' : run.status === 'running' ? 'info' : 'success';
  const title = run.status === 'failed' ? 'This run failed' : run.status === 'running' ? 'Started; still running' : 'Run finished';
  return (
    <Notice tone={tone} title={title} className="mt-2 max-w-xs">
      {run.status === 'failed' ? run.error : run.summary ? summaryWords(run.summary) : 'No summary was given.'}
    </Notice>
  );
}

/** `{ lateBookings: 2, firms: 1 }` → "late bookings 2, firms 1". */
function summaryWords(summary: NonNullable<RoutineRunView['summary']>): string {
  return Object.entries(summary)
    .map(([key, value]) => `${key.replace(/([A-Z])/g, ' $1').toLowerCase()} ${value}`)
    .join(', ');
}
