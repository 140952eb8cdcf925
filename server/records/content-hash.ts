import { createHash } from 'node:crypto';
import type { EquipmentRecordView } from '../../shared/records/views';

/** JSON with every object's keys in code-point order (as RFC 8785 sorts them), so equal content gives equal text. */
export function canonicalJson(value: unknown): string {
  return JSON.stringify(value, (_key, v: unknown) =>
    v && typeof v === 'object' && !Array.isArray(v)
      ? Object.fromEntries(Object.entries(v as Record<string, unknown>).sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0)))
      : v,
  );
}

export const sha256 = (data: string | Buffer) => createHash('sha256').update(data).digest('hex');

/** The record's content: all of it but when it was put together and what today makes of the due date. */
export function recordContentHash(view: Omit<EquipmentRecordView, 'contentHash'>): string {
  const { generatedAt: _generatedAt, recordDate: _recordDate, ...content } = view;
  const { state: _state, ...plan } = content.asset.calibration;
  return sha256(canonicalJson({ ...content, asset: { ...content.asset, calibration: plan } }));
}
