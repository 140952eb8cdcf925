import type { AssetView, EquipmentRecordItem } from '../../shared/assets/views';
import { assetStatusWords } from '../../shared/assets/record-words';
import { checkKindTitles } from '../../shared/checks/vocabulary';
import type { EquipmentRecordView } from '../../shared/records/views';
import type { MeasureWords } from '../../shared/records/check-lines';
import { assetTypeTitles, typesWithFirmware } from '../../shared/schemas/assets';

const text = (...parts: (string | null | undefined)[]) => parts.filter(Boolean).join(' · ') || null;
const words = (value: string) => value.replace(/_/g, ' ');
const count = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;

type Sections = Pick<EquipmentRecordView, 'calibrations' | 'checks' | 'holds' | 'incidents' | 'impactReviews' | 'intervalChanges' | 'reference'>;

/**
 * How a record's sentences write a date (a calendar date or a moment's day) and its measures: in the firm's format for
 * the reader, and in one fixed form (ISO dates, numbers as stored) for the content hash (record-assembly.ts).
 */
export type RecordWords = MeasureWords & { date: (value: string) => string };

/**
 * The equipment record an auditor asks for: one entry per item of ISO/IEC 17025:2017 §6.4.13 a)–h) (the items'
 * wording paraphrased from memory of the standard), each saying in a line what Nestkeeper holds for it; the
 * record's sections below it carry every event.
 */
export function equipmentRecordItems(a: AssetView, s: Sections, say: RecordWords): EquipmentRecordItem[] {
  const cal = a.calibration;
  const specs = a.specs as Record<string, unknown>;
  const latest = s.calibrations.at(-1);
  const lastCheck = s.checks.at(-1);
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
      value: text(
        latest
          ? `${count(s.calibrations.length, 'calibration')}; latest ${say.date(latest.performedOn)}, certificate ${latest.certificateNumber} from ${latest.provider}, as found ${words(latest.asFound)}, as left ${words(latest.asLeft)}`
          : null,
        lastCheck
          ? `${count(s.checks.length, 'field check')}; latest ${checkKindTitles[lastCheck.kind].toLowerCase()} on ${say.date(lastCheck.performedAt)}: ${lastCheck.decision}`
          : null,
      ),
      ...(latest || lastCheck ? {} : { note: 'No calibration certificate or field check is on record for this period.' }),
    },
    {
      clause: '6.4.13 d)',
      requirement: 'Current location',
      value: text(a.location, `status: ${assetStatusWords[a.status]}`, a.kit ? `kit ${a.kit.name}` : null),
    },
    {
      clause: '6.4.13 e)',
      requirement: 'Calibration dates, results, adjustments, acceptance criteria, and the due date of the next calibration or the calibration interval',
      value: cal.required
        ? text(
            cal.lastCalibratedOn ? `last ${say.date(cal.lastCalibratedOn)}` : 'no calibration on record',
            cal.intervalMonths ? `interval ${cal.intervalMonths} months` : null,
            cal.dueOn ? `due ${say.date(cal.dueOn)}` : null,
            s.intervalChanges.length ? count(s.intervalChanges.length, 'interval decision') : null,
          )
        : 'Calibration not required for this item',
      ...(cal.required && !latest ? { note: 'No certificate is on record for this period: the results and adjustments cannot be shown.' } : {}),
    },
    {
      clause: '6.4.13 f)',
      requirement: 'Documentation of reference materials, results, acceptance criteria, relevant dates and the period of validity',
      value: s.reference
        ? text(
            ...s.reference.values.map((v) => `${v.label} ${v.value}`),
            s.reference.certificateNumber ? `certificate ${s.reference.certificateNumber}` : null,
            s.reference.validThrough ? `valid ${s.reference.validFrom ? say.date(s.reference.validFrom) : '?'} to ${say.date(s.reference.validThrough)}` : null,
          )
        : null,
      ...(s.reference
        ? s.reference.certificateNumber
          ? {}
          : { note: 'No certificate on record for these certified values.' }
        : { note: 'Not a reference artefact.' }),
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
      value:
        text(
          a.status === 'retired' ? `Retired: ${a.retiredReason}` : specs.damaged ? 'Marked damaged' : null,
          s.incidents.length ? count(s.incidents.length, 'incident') : null,
          s.holds.length ? count(s.holds.length, 'hold') : null,
          s.impactReviews.length ? count(s.impactReviews.length, 'impact review') : null,
        ) ?? 'None recorded',
    },
  ];
}
