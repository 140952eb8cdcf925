import type { BookingRefusalDetails } from '../../shared/bookings/views';
import type { FirmFormat } from '../../shared/formatting/firm-format';
import { blockReason, blockReasonText, type BlockReason } from '../../shared/bookings/rules';
import type { AssetType } from '../../shared/schemas/assets';
import type { BookingPurpose } from '../../shared/schemas/bookings';
import type { Scoped } from '../db/scoped';
import { AppError } from '../http/errors';
import { itemFacts, type ItemFacts } from './booking-queries';

type Refusal = { assetId: string; assetTag: string; type: AssetType; reason: BlockReason; dueOn: string | null };

/** The items that may not go on a booking ending `endsOn`, in tag order: the shared rule (shared/bookings/rules.ts) applied to their facts. */
export function refusedItems(facts: ItemFacts[], endsOn: string, purpose: BookingPurpose): Refusal[] {
  return facts.flatMap(({ assetId, assetTag, type, status, calibrationRequired, dueOn, tipValidated }) => {
    const reason = blockReason({ type, status, calibration: { required: calibrationRequired, dueOn }, tipValidated }, endsOn, purpose);
    return reason ? [{ assetId, assetTag, type, reason, dueOn }] : [];
  });
}

/** `refusedItems` for items known by id: their facts in one query. */
export async function refusals(tx: Scoped, assetIds: string[], endsOn: string, purpose: BookingPurpose) {
  return refusedItems(await itemFacts(tx, assetIds), endsOn, purpose);
}

/** Why, in words; a calibration that runs out names its due date in the firm's format. */
function refusalText(r: Refusal, f: FirmFormat) {
  if (r.reason !== 'calibration_expires') return blockReasonText[r.reason];
  return r.dueOn ? `its calibration runs out after ${f.date(r.dueOn)}, before the booking ends` : 'it has no calibration on record';
}

/** 422 `booking_blocked` naming each item and why (API.md); the details keep the codes. */
export function blockedError(doing: string, refused: Refusal[], f: FirmFormat, details: Pick<BookingRefusalDetails, 'alternatives'> = {}) {
  return new AppError(422, 'booking_blocked', `${doing}: ${refused.map((r) => `${r.assetTag} — ${refusalText(r, f)}`).join('; ')}.`, {
    blocked: refused.map(({ assetId, assetTag, reason }) => ({ assetId, assetTag, reason })),
    ...details,
  } satisfies BookingRefusalDetails);
}
