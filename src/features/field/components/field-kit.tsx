import { Link } from 'react-router-dom';
import { AssetStatusChip, CalibrationChip } from '../../../components/asset-status';
import { CountedSection } from '../../../components/counted-section';
import { StatusChip } from '../../../components/status-chip';
import { assetTypeTitles } from '../../../lib/assets';
import type { StoredCopy } from '../../../lib/field/field-store';
import { formatCalendarDate, formatDateRange, formatDateTime, formatUm } from '../../../lib/format';
import type { AssetView } from '../../../../shared/assets/views';
import type { BookingView } from '../../../../shared/bookings/views';
import type { FieldCopyView } from '../../../../shared/field/views';

const bookingName = (b: BookingView) => b.kit?.name ?? b.job?.reference ?? b.rental?.number ?? 'Booked items';
const days = (b: BookingView) => formatDateRange(b.startsOn, b.endsOn);

/** Tip positions whose latest validation on this phone's copy did not pass (or never happened): what the booking rules would refuse. */
export function tipsToValidate(copy: FieldCopyView) {
  return copy.items
    .filter((i) => i.type === 'tip' && i.status !== 'retired')
    .flatMap((tip) =>
      ((tip.specs.positions as string[] | undefined) ?? []).map((position) => ({
        tip,
        position,
        last: copy.tipValidations.find((v) => v.assetId === tip.id && v.position === position) ?? null,
      })),
    )
    .filter((t) => t.last?.decision !== 'pass');
}

/** One item as a line: tag, type words, RFID tag, status and calibration due date. */
function ItemLine({ item }: { item: AssetView }) {
  return (
    <li>
      <Link to={`/fleet/${item.id}`} className="flex min-h-11 flex-wrap items-center gap-x-3 gap-y-1 px-1 py-1.5 hover:bg-brass-wash">
        <span className="font-mono font-semibold text-ink-900 whitespace-nowrap">{item.assetTag}</span>
        <span className="text-sm text-ink-700">{assetTypeTitles[item.type]}</span>
        {item.rfidTag ? <span className="font-mono text-sm text-ink-700">RFID {item.rfidTag}</span> : null}
        <span className="ml-auto flex flex-wrap gap-1">
          <AssetStatusChip status={item.status} />
          <CalibrationChip state={item.calibration.state} dueOn={item.calibration.dueOn} />
        </span>
        {item.calibration.dueOn ? (
          <span className="w-full text-right text-sm text-ink-700">Calibration due {formatCalendarDate(item.calibration.dueOn)}</span>
        ) : null}
      </Link>
    </li>
  );
}

/** The items of one kit (or booking) as this phone's copy has them. */
export function FieldKitItems({ items }: { items: AssetView[] }) {
  return (
    <ul className="divide-y divide-paper-line" aria-label="Items">
      {items.map((item) => (
        <ItemLine key={item.id} item={item} />
      ))}
    </ul>
  );
}

/** The technician's home without signal: the kit carried now and next, and the tips to validate, from this phone's copy. */
export function FieldKitPanels({ stored }: { stored: StoredCopy }) {
  const { copy } = stored;
  const line = (b: BookingView) => (
    <li key={b.id} className="flex flex-wrap items-baseline gap-x-3 gap-y-0.5 py-1.5">
      {b.kitId ? (
        <Link to={`/kits/${b.kitId}`} className="font-semibold text-brass-deep underline">
          {bookingName(b)}
        </Link>
      ) : (
        <span className="font-semibold">{bookingName(b)}</span>
      )}
      <span className="text-sm text-ink-700">
        {days(b)} · {b.assetIds.length} items
      </span>
      <span className="w-full font-mono text-sm text-ink-700">{b.items.map((i) => i.assetTag).join(', ')}</span>
    </li>
  );
  const toValidate = tipsToValidate(copy);
  return (
    <>
      <CountedSection id="kit-now" title="Kit I carry now" count={copy.bookings.now.length} empty="No kit is checked out to you.">
        <ul className="divide-y divide-paper-line">{copy.bookings.now.map(line)}</ul>
      </CountedSection>
      <CountedSection id="kit-next" title="Next" count={copy.bookings.next.length} empty="Nothing is booked for you next.">
        <ul className="divide-y divide-paper-line">{copy.bookings.next.map(line)}</ul>
      </CountedSection>
      <CountedSection id="checks-to-do" title="Checks to do" count={toValidate.length} empty="Every tip position you carry has a passing validation.">
        <ul className="divide-y divide-paper-line">
          {toValidate.map(({ tip, position, last }) => (
            <li key={`${tip.id}-${position}`}>
              <Link
                to={`/checks/new?assetId=${tip.id}&kind=tip_validation`}
                className="flex min-h-11 flex-wrap items-center gap-x-3 px-1 py-1.5 hover:bg-brass-wash"
              >
                <span className="font-mono font-semibold whitespace-nowrap">{tip.assetTag}</span>
                <span className="text-sm">{position}</span>
                <span className="ml-auto">{last ? <StatusChip tone="bad" label="Failed last time" /> : <StatusChip tone="warn" label="Not validated" />}</span>
              </Link>
            </li>
          ))}
        </ul>
      </CountedSection>
    </>
  );
}

/** A tip's latest validation per position, from this phone's copy. */
export function FieldTipValidations({ copy, tip }: { copy: FieldCopyView; tip: AssetView }) {
  const positions = (tip.specs.positions as string[] | undefined) ?? [];
  return (
    <section aria-labelledby="field-tip-heading" className="rounded-lg border border-paper-line bg-card p-4">
      <h2 id="field-tip-heading" className="mb-2 text-lg font-bold">
        Latest validation per position
      </h2>
      <ul className="divide-y divide-paper-line">
        {positions.map((position) => {
          const last = copy.tipValidations.find((v) => v.assetId === tip.id && v.position === position);
          return (
            <li key={position} className="flex flex-wrap items-center gap-2 py-2">
              <span className="font-semibold capitalize">{position}</span>
              {last ? (
                <>
                  <StatusChip tone={last.decision === 'pass' ? 'ok' : 'bad'} label={last.decision === 'pass' ? 'Passed' : 'Failed'} />
                  <span className="text-sm text-ink-700">
                    {formatDateTime(last.performedAt)}
                    {last.maxDeviationUm !== null ? ` · ${formatUm(last.maxDeviationUm)} of ${formatUm(last.toleranceUm)}` : ''}
                  </span>
                </>
              ) : (
                <StatusChip tone="warn" label="Not validated" />
              )}
            </li>
          );
        })}
      </ul>
    </section>
  );
}
