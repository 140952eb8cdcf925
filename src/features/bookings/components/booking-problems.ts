import { formatCalendarDate, formatDateRange } from '../../../lib/format';
import type { AssetView } from '../../../../shared/assets/views';
import { blockReason, blockReasonText, rangesOverlap } from '../../../lib/bookings';
import type { BookingView } from '../../../../shared/bookings/views';
import { bookingStateWords, bookingTitle } from './booking-words';

export interface BookingProblem {
  key: string;
  /** The items this sentence is about. */
  assetTags: string[];
  kind: 'blocked' | 'conflict';
  sentence: string;
  /** The other booking, for a conflict. */
  bookingId?: string;
}

/**
 * Why the server would refuse these items for these dates, in plain words, from
 * what the browser already has: each item's status and due date (the shared
 * rules in shared/bookings/rules.ts) and the other bookings in the window.
 * Items held by the same other booking share one sentence. Tip validations are
 * not known here; the server still checks them.
 */
export function bookingProblems(items: AssetView[], startsOn: string, endsOn: string, others: BookingView[], exceptBookingId?: string): BookingProblem[] {
  const problems: BookingProblem[] = [];
  const clashes = new Map<string, { other: BookingView; tags: string[] }>();
  const window = { startsOn, endsOn };
  for (const item of items) {
    const reason = blockReason(item, endsOn);
    if (reason) {
      problems.push({ key: `block-${item.id}`, assetTags: [item.assetTag], kind: 'blocked', sentence: blockedSentence(item, reason, startsOn, endsOn) });
      continue;
    }
    for (const other of others) {
      if (other.id === exceptBookingId || (other.state !== 'reserved' && other.state !== 'out')) continue;
      if (!other.assetIds.includes(item.id) || !rangesOverlap(window, other)) continue;
      const clash = clashes.get(other.id) ?? { other, tags: [] };
      clash.tags.push(item.assetTag);
      clashes.set(other.id, clash);
    }
  }
  for (const { other, tags } of clashes.values()) {
    const who = tags.length === 1 ? `${tags[0]} is` : `${tags.slice(0, -1).join(', ')} and ${tags[tags.length - 1]} are`;
    problems.push({
      key: `clash-${other.id}`,
      assetTags: tags,
      kind: 'conflict',
      bookingId: other.id,
      sentence: `${who} already booked ${formatDateRange(other.startsOn, other.endsOn)} for ${bookingTitle(other)} (${bookingStateWords[other.state].toLowerCase()}).`,
    });
  }
  return problems;
}

function blockedSentence(item: AssetView, reason: ReturnType<typeof blockReason> & string, startsOn: string, endsOn: string): string {
  if (reason === 'calibration_expires') {
    const dueOn = item.calibration.dueOn;
    if (!dueOn) return `${item.assetTag} has no calibration on record, so it cannot go out.`;
    if (dueOn < startsOn) return `${item.assetTag} is due for calibration on ${formatCalendarDate(dueOn)}, before this booking starts.`;
    return `${item.assetTag} falls due on ${formatCalendarDate(dueOn)}, during this booking (ends ${formatCalendarDate(endsOn)}).`;
  }
  return `${item.assetTag} cannot go: ${blockReasonText[reason]}.`;
}
