import { calibrationState } from '../../shared/calibration/due-date';
import type { AssetView } from '../../shared/assets/views';
import type { OrgContext } from '../organizations';
import type { Asset } from './asset.entity';

/** The QR label's payload: an address a phone camera can open, which lookup also resolves. */
export const qrPayloadFor = (publicUrl: string, assetId: string) => `${publicUrl.replace(/\/$/, '')}/scan/${assetId}`;

export function toAssetView(a: Asset, ctx: OrgContext, publicUrl: string): AssetView {
  return {
    id: a.id,
    type: a.type,
    assetTag: a.assetTag,
    serialNumber: a.serialNumber,
    manufacturer: a.manufacturer,
    model: a.model,
    firmwareVersion: a.firmwareVersion,
    rfidTag: a.rfidTag,
    location: a.location,
    replacementValueMinor: a.replacementValueMinor,
    currency: ctx.currency,
    notes: a.notes,
    status: a.status,
    specs: a.specs,
    kit: a.kit ? { id: a.kit.id, name: a.kit.name } : null,
    calibration: {
      required: a.calibrationRequired,
      intervalMonths: a.calibrationIntervalMonths,
      provider: a.calibrationProvider,
      lastCalibratedOn: a.lastCalibratedOn,
      dueOn: a.dueOn,
      state: calibrationState(a.calibrationRequired, a.dueOn, ctx.today, ctx.dueSoonDays),
    },
    toleranceOverrides: a.toleranceOverrides ?? null,
    qrPayload: qrPayloadFor(publicUrl, a.id),
    retiredAt: a.retiredAt?.toISOString() ?? null,
    retiredReason: a.retiredReason,
    createdAt: a.createdAt.toISOString(),
    updatedAt: a.updatedAt.toISOString(),
  };
}
