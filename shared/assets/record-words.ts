/**
 * How an item's record reads to a person: the chain of custody, holds and the history line. The stored codes
 * (`checked_out`, `asset.held`, `failed_check`) never reach a screen, a mail or a PDF; these words do.
 */
import type { AssetStatus } from './vocabulary';
import { checkKindTitles } from '../checks/vocabulary';
import { incidentKindTitles, type IncidentKind } from '../incidents/vocabulary';

/** An item's status inside a sentence ("TRK-001 is on hold"). */
export const assetStatusWords: Record<AssetStatus, string> = { ready: 'ready', out: 'out', at_lab: 'at the lab', held: 'on hold', retired: 'retired' };

/** The kinds of custody event fleet/custody.ts writes. */
export const custodyKinds = [
  'registered',
  'checked_out',
  'returned',
  'sent_to_lab',
  'back_from_lab',
  'held',
  'released',
  'retired',
  'moved',
  'calibrated',
] as const;
export type CustodyKind = (typeof custodyKinds)[number];

export const custodyWords: Record<CustodyKind, string> = {
  registered: 'Taken into the fleet',
  checked_out: 'Handed out',
  returned: 'Returned',
  sent_to_lab: 'Sent to the calibration lab',
  back_from_lab: 'Back from the calibration lab',
  held: 'Put on hold',
  released: 'Released from hold',
  retired: 'Taken out of service for good',
  moved: 'Moved',
  calibrated: 'Calibrated',
};

const isCustodyKind = (kind: string): kind is CustodyKind => (custodyKinds as readonly string[]).includes(kind);
/** A custody event's name; a kind this list does not know yet still reads as words. */
export const custodyWord = (kind: string) => (isCustodyKind(kind) ? custodyWords[kind] : 'Custody recorded');

const positionWords: Record<string, string> = { vertical: 'vertical', horizontal: 'horizontal' };
const asFoundWords: Record<string, string> = { in_tolerance: 'in tolerance', out_of_tolerance: 'out of tolerance', not_reported: 'not reported' };
const assessmentWords: Record<string, string> = {
  no_effect: 'no effect on the results',
  customer_notified: 'customer notified',
  remeasure_offered: 're-measurement offered',
};
const intervalWords: Record<string, string> = { accepted: 'Suggested calibration interval accepted', declined: 'Suggested calibration interval declined' };

/** `serialNumber` → "serial number": the asset fields an edit changed, as a person names them. */
const fieldWords = (fields: string[]) => fields.map((f) => f.replace(/([A-Z])/g, ' $1').toLowerCase()).join(', ');
const count = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;
const str = (v: unknown) => (typeof v === 'string' && v ? v : null);

/**
 * Audit lines the chain of custody already says: every status move writes a custody event and an `asset.<kind>` audit
 * line (custody.ts), and every registration a `registered` event beside `asset.created`. The history lists each once.
 */
export const repeatsCustody = (action: string) => action === 'asset.created' || (action.startsWith('asset.') && isCustodyKind(action.slice('asset.'.length)));

type HistoryDetails = Record<string, unknown>;

/** One line of an item's history: a custody event (`source` custody, details holder/location/note) or an audit line. */
export function historyLine(source: 'audit' | 'custody', action: string, details: HistoryDetails): string {
  return source === 'custody' ? custodyLine(action, details) : auditLine(action, details);
}

function custodyLine(kind: string, d: HistoryDetails): string {
  const holder = str(d.holder);
  const location = str(d.location);
  const note = str(d.note);
  let line = custodyWord(kind);
  if (kind === 'registered' && location) line += ` at ${location}`;
  else if (kind === 'moved') line += ` to ${location ?? 'no recorded location'}`;
  else if ((kind === 'checked_out' || kind === 'sent_to_lab') && holder) line += ` to ${holder}`;
  return note ? `${line}: ${note}` : line;
}

function auditLine(action: string, d: HistoryDetails): string {
  switch (action) {
    case 'asset.created':
      return 'Registered in the fleet';
    case 'asset.updated':
      return `Record changed: ${fieldWords(Object.keys((d.changes as object) ?? {})) || 'no field named'}`;
    case 'asset.hold_reason_added':
      return `Another reason to keep it on hold${str(d.summary) ? `: ${d.summary}` : ''}`;
    case 'check.recorded': {
      const title = checkKindTitles[d.kind as keyof typeof checkKindTitles] ?? 'Field check';
      const position = str(d.position) ? ` (${positionWords[d.position as string] ?? 'other'} position)` : '';
      return `${title}${position} recorded: ${d.decision === 'fail' ? 'failed' : 'passed'}`;
    }
    case 'incident.reported':
      return `Damage reported: ${incidentKindTitles[d.kind as IncidentKind] ?? 'something else'}`;
    case 'incident.updated':
      return 'Damage report reviewed';
    case 'impact_review.opened':
      return `Impact review opened${typeof d.bookings === 'number' ? `: ${count(d.bookings, 'job')} to assess` : ''}`;
    case 'impact_review.assessed':
      return `Impact review: a job assessed${assessmentWords[d.assessment as string] ? `, ${assessmentWords[d.assessment as string]}` : ''}`;
    case 'impact_review.notices_sent':
      return 'Impact review: notices sent to customers';
    case 'impact_review.closed':
      return 'Impact review closed';
    case 'calibration.recorded':
      return `Calibration recorded${asFoundWords[d.asFound as string] ? `: as found ${asFoundWords[d.asFound as string]}` : ''}`;
    default:
      if (action.startsWith('calibration.interval_')) return intervalWords[action.slice('calibration.interval_'.length)] ?? 'Calibration interval changed';
      if (action.startsWith('asset.') && isCustodyKind(action.slice('asset.'.length))) return custodyLine(action.slice('asset.'.length), d);
      return 'Change recorded';
  }
}
