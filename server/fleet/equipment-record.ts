import type { AssetView, EquipmentRecordItem } from '../../shared/assets/views';
import { assetTypeTitles, typesWithFirmware } from '../../shared/schemas/assets';

const text = (...parts: (string | null | undefined)[]) => parts.filter(Boolean).join(' · ') || null;

/**
 * The equipment record an auditor asks for: one entry per item of
 * ISO/IEC 17025:2017 §6.4.13 a)–h) (the items' wording paraphrased from
 * memory of the standard), each saying what Nestkeeper holds for it.
 */
export function equipmentRecordItems(a: AssetView): EquipmentRecordItem[] {
  const cal = a.calibration;
  const specs = a.specs as Record<string, unknown>;
  const reference =
    a.type === 'reference_sphere' || a.type === 'smr'
      ? `Diameter ${specs.diameterMm} mm`
      : a.type === 'scale_bar'
        ? `Certified length ${specs.certifiedLengthMm} mm at 20 °C; expansion ${specs.expansionPpmPerK} µm/(m·K)`
        : null;
  return [
    {
      clause: '6.4.13 a)',
      requirement: 'Identity of the equipment, including software and firmware version',
      value: text(
        `${a.assetTag} (${assetTypeTitles[a.type]})`,
        a.firmwareVersion ? `firmware ${a.firmwareVersion}` : null,
        a.rfidTag ? `RFID ${a.rfidTag}` : null,
      ),
      ...(typesWithFirmware.includes(a.type) && !a.firmwareVersion ? { note: 'No firmware version recorded.' } : {}),
    },
    {
      clause: '6.4.13 b)',
      requirement: "Manufacturer's name, type identification and serial number or other unique identification",
      value: text(a.manufacturer, a.model, `S/N ${a.serialNumber}`),
    },
    {
      clause: '6.4.13 c)',
      requirement: 'Evidence of verification that the equipment conforms with specified requirements',
      value: cal.lastCalibratedOn ? `Calibrated on ${cal.lastCalibratedOn}${cal.provider ? ` by ${cal.provider}` : ''}` : null,
      note: 'Certificates and field checks are listed here once they are recorded.',
    },
    {
      clause: '6.4.13 d)',
      requirement: 'Current location',
      value: text(a.location, `status: ${a.status.replace('_', ' ')}`, a.kit ? `kit ${a.kit.name}` : null),
    },
    {
      clause: '6.4.13 e)',
      requirement: 'Calibration dates, results, adjustments, acceptance criteria, and the due date of the next calibration or the calibration interval',
      value: cal.required
        ? text(
            cal.lastCalibratedOn ? `last ${cal.lastCalibratedOn}` : 'no calibration on record',
            cal.intervalMonths ? `interval ${cal.intervalMonths} months` : null,
            cal.dueOn ? `due ${cal.dueOn}` : null,
            `state: ${cal.state.replace('_', ' ')}`,
          )
        : 'Calibration not required for this item',
    },
    {
      clause: '6.4.13 f)',
      requirement: 'Documentation of reference materials, results, acceptance criteria, relevant dates and the period of validity',
      value: reference,
      ...(reference ? {} : { note: 'Not a reference artefact.' }),
    },
    {
      clause: '6.4.13 g)',
      requirement: 'The maintenance plan and maintenance carried out to date, where relevant to performance',
      value: text(
        cal.required && cal.intervalMonths ? `Recalibrate every ${cal.intervalMonths} months${cal.provider ? ` at ${cal.provider}` : ''}` : null,
        a.type === 'battery' && specs.chargeCycles !== undefined ? `${specs.chargeCycles} charge cycles` : null,
      ),
    },
    {
      clause: '6.4.13 h)',
      requirement: 'Details of any damage, malfunction, modification to, or repair of, the equipment',
      value: a.status === 'retired' ? `Retired: ${a.retiredReason}` : specs.damaged ? 'Marked damaged' : 'None recorded',
      note: 'Damage reports appear here once incidents are recorded.',
    },
  ];
}
