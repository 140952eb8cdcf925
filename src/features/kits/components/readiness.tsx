import { StatusChip } from '../../../components/status-chip';
import type { KitReadiness } from '../../../../shared/assets/views';

const reasonWords: Record<KitReadiness['reasons'][number]['reason'], string> = {
  not_ready: 'not on the shelf ready',
  calibration_overdue: 'calibration overdue',
};

export function readinessReasonText(reason: KitReadiness['reasons'][number]): string {
  return `${reason.assetTag}: ${reasonWords[reason.reason] ?? reason.reason}`;
}

export function ReadinessChip({ readiness }: { readiness: KitReadiness }) {
  return readiness.ready ? (
    <StatusChip tone="ok" label="Ready" />
  ) : (
    <StatusChip tone="bad" label="Not ready" title={readiness.reasons.map(readinessReasonText).join('; ')} />
  );
}

/** The chip with each reason spelled out. */
export function ReadinessSummary({ readiness, memberCount }: { readiness: KitReadiness; memberCount: number }) {
  return (
    <div className="flex flex-col gap-2 rounded-lg border border-paper-line bg-card p-4">
      <div className="flex flex-wrap items-center gap-2">
        <ReadinessChip readiness={readiness} />
        <span className="text-ink-700">
          {memberCount === 0
            ? 'The kit has no members yet.'
            : readiness.ready
              ? `All ${memberCount} ${memberCount === 1 ? 'item is' : 'items are'} ready and in calibration.`
              : `${readiness.reasons.length} ${readiness.reasons.length === 1 ? 'item stops' : 'items stop'} the kit going out:`}
        </span>
      </div>
      {!readiness.ready && readiness.reasons.length ? (
        <ul className="ml-5 list-disc text-ink-900">
          {readiness.reasons.map((r) => (
            <li key={`${r.assetId}-${r.reason}`}>{readinessReasonText(r)}</li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}
