import type { ReactNode } from 'react';
import type { EquipmentRecordView } from '../../../../shared/records/views';
import { Panel } from '../../../components/panel';
import { apiUrl } from '../../../lib/api-client';
import { checkKindTitles } from '../../../../shared/checks/vocabulary';
import { custodyWord } from '../../../../shared/assets/record-words';
import { holdReasonWords } from '../../../../shared/holds/release-rule';
import { incidentKindTitles, incidentStateTitles, type IncidentKind, type IncidentState } from '../../../../shared/incidents/vocabulary';
import { formatCalendarDate, formatDateRange, useFirmFormat } from '../../../lib/format';

const words = (v: string) => v.replace(/_/g, ' ');
const someone = (name: string | null) => name ?? 'someone no longer on record';
const assessmentWords = { no_effect: 'No effect on the results', customer_notified: 'Customer notified', remeasure_offered: 'Re-measurement offered' } as const;

/** A section of the record: its entries, or the sentence that says there are none (never an empty table). */
function Section({ title, count, empty, children }: { title: string; count: number; empty: string; children: ReactNode }) {
  return (
    <Panel title={`${title} (${count === 0 ? 'none' : count})`}>
      {count === 0 ? <p className="text-sm text-ink-700">{empty}</p> : <ol className="flex flex-col divide-y divide-paper-line">{children}</ol>}
    </Panel>
  );
}

function Entry({ heading, lines }: { heading: ReactNode; lines: (ReactNode | null)[] }) {
  return (
    <li className="py-2">
      <p className="font-semibold text-ink-900">{heading}</p>
      <ul className="mt-1 text-sm text-ink-800">
        {lines.filter(Boolean).map((line, i) => (
          <li key={i} className="break-words">
            {line}
          </li>
        ))}
      </ul>
    </li>
  );
}

/** Every event the record holds, dated and signed, section by section as the PDF prints them. */
export function EquipmentRecordSections({ record }: { record: EquipmentRecordView }) {
  const { dateTime } = useFirmFormat();
  return (
    <div className="flex flex-col gap-4">
      <Section title="Calibrations and certificates" count={record.calibrations.length} empty="No calibration is on record for this item in the period.">
        {record.calibrations.map((c) => (
          <Entry
            key={c.id}
            heading={
              <>
                {formatCalendarDate(c.performedOn)} · {c.provider} · certificate{' '}
                <a className="font-mono text-brass-deep underline" href={apiUrl(c.certificateUrl)} target="_blank" rel="noopener">
                  {c.certificateNumber}
                </a>
              </>
            }
            lines={[
              `As found ${words(c.asFound)} · as left ${words(c.asLeft)}`,
              c.adjustment,
              `Interval ${c.intervalMonths} months, due ${formatCalendarDate(c.dueOn)}`,
              c.certificate
                ? c.certificate.readable
                  ? `File ${c.certificate.fileName}, SHA-256 ${c.certificate.sha256}`
                  : `The stored file ${c.certificate.fileName} cannot be read as a PDF.`
                : 'No certificate file is on record for this calibration.',
              c.note,
              `Recorded ${dateTime(c.recordedAt)} by ${someone(c.recordedBy)}`,
            ]}
          />
        ))}
      </Section>
      <Section title="Field checks" count={record.checks.length} empty="No field check is on record for this item in the period.">
        {record.checks.map((c) => (
          <Entry
            key={c.id}
            heading={`${checkKindTitles[c.kind]}${c.position ? ` (${c.position})` : ''} · ${dateTime(c.performedAt)} · ${c.decision === 'pass' ? 'Pass' : 'Fail'}`}
            lines={[
              c.relatedAssetTag ? `With ${c.relatedAssetTag}` : null,
              ...c.inputLines,
              ...c.resultLines,
              `Tolerance ${c.toleranceUm} µm · U = ${c.expandedUncertaintyUm} µm (k = 2) · guard band ${c.guardBandUm} µm · ${c.decisionRule} acceptance`,
              c.note,
              `By ${someone(c.performedBy)}`,
            ]}
          />
        ))}
      </Section>
      <Section title="Holds and releases" count={record.holds.length} empty="The item was not on hold in the period.">
        {record.holds.map((h) => (
          <Entry
            key={h.id}
            heading={`${holdReasonWords[h.reason]} · ${h.summary}`}
            lines={[
              `Held ${dateTime(h.startedAt)} by ${someone(h.startedBy)}`,
              h.releasedAt ? `Released ${dateTime(h.releasedAt)} by ${someone(h.releasedBy)}` : 'Still on hold',
              ...(h.releasedAt
                ? h.releaseEvidence.length
                  ? h.releaseEvidence.map((e) => `Evidence: ${e}`)
                  : ['No evidence is on record for this release.']
                : []),
              h.releaseNote,
            ]}
          />
        ))}
      </Section>
      <Section title="Incidents" count={record.incidents.length} empty="No damage, loss or malfunction was reported for this item in the period.">
        {record.incidents.map((i) => (
          <li key={i.id} className="py-2">
            <Entry
              heading={`${incidentKindTitles[i.kind as IncidentKind] ?? 'Damage or loss'} · ${dateTime(i.occurredAt)} · ${incidentStateTitles[i.state as IncidentState] ?? 'Reported'}`}
              lines={[i.description, i.location, i.resolution, `Reported by ${someone(i.reportedBy)}`, i.photos.length ? null : 'No photos were taken.']}
            />
            <div className="flex flex-wrap gap-2">
              {i.photos.map((p) =>
                p.thumbnailUrl ? (
                  <img key={p.id} src={apiUrl(p.thumbnailUrl)} alt={p.fileName} className="h-20 w-28 rounded border border-paper-line object-cover" />
                ) : (
                  <span key={p.id} className="text-sm text-ink-700">
                    {p.fileName} (no thumbnail)
                  </span>
                ),
              )}
            </div>
          </li>
        ))}
      </Section>
      <Section title="Impact reviews" count={record.impactReviews.length} empty="No impact review concerns this item in the period.">
        {record.impactReviews.map((r) => (
          <Entry
            key={r.id}
            heading={`Found ${r.trigger === 'calibration' ? 'out of tolerance as found' : 'failing a field check'} on ${formatCalendarDate(r.foundOn)} · review ${r.state}`}
            lines={[
              `Last passing evidence ${r.since ? formatCalendarDate(r.since) : 'none on record'}`,
              ...(r.bookings.length
                ? r.bookings.map(
                    (b) =>
                      `${b.jobReference ?? 'Booking'} (${b.customerName ?? 'no customer'}, ${formatDateRange(b.startsOn, b.endsOn)}): ${
                        b.assessment ? `${assessmentWords[b.assessment]}${b.note ? `: ${b.note}` : ''} — ${someone(b.assessedBy)}` : 'not assessed yet'
                      }${b.noticeQueuedAt ? ` · notice sent to ${b.noticeTo} ${dateTime(b.noticeQueuedAt)}` : ''}`,
                  )
                : ['No booking used the item between its last passing evidence and the finding.']),
            ]}
          />
        ))}
      </Section>
      <Section title="Calibration interval changes" count={record.intervalChanges.length} empty="The calibration interval did not change in the period.">
        {record.intervalChanges.map((c, i) => (
          <Entry key={i} heading={`${c.fromMonths ?? '—'} → ${c.toMonths ?? '—'} months`} lines={[c.reason, `${dateTime(c.at)} by ${someone(c.by)}`]} />
        ))}
      </Section>
      <Section title="Chain of custody" count={record.custody.length} empty="No hand-over, lab shipment, return, hold or release is on record in the period.">
        {record.custody.map((c, i) => (
          <Entry
            key={i}
            heading={`${custodyWord(c.kind)} · ${dateTime(c.at)}`}
            lines={[c.holder ? `Holder ${c.holder}` : null, c.location, c.note, c.by ? `By ${c.by}` : null]}
          />
        ))}
      </Section>
    </div>
  );
}
