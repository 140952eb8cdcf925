import { describe, expect, it } from 'vitest';
import { custodyKinds, custodyWord, historyLine, repeatsCustody } from './record-words';

// Wording, not computation: the checks are that no stored code reaches a reader and each event is listed once.
const rawCode = /_|\b(?:asset|check|incident|impact_review|calibration)\.|^held$|\(impact\)/;

describe("an item's history in words", () => {
  it('names every custody event in words, never its code', () => {
    for (const kind of custodyKinds) {
      expect(custodyWord(kind)).not.toMatch(rawCode);
      expect(custodyWord(kind)).toMatch(/^[A-Z]/);
    }
    expect([custodyWord('held'), custodyWord('checked_out')]).toEqual(['Put on hold', 'Handed out']);
    expect(custodyWord('some_future_kind')).toBe('Custody recorded');
  });

  it('says who has the item and why it moved', () => {
    expect(historyLine('custody', 'held', { location: 'Shop', note: 'Dropped: reported from site' })).toBe('Put on hold: Dropped: reported from site');
    expect(historyLine('custody', 'checked_out', { holder: 'Tamsin Quillfeather', note: 'good' })).toBe('Handed out to Tamsin Quillfeather: good');
    expect(historyLine('custody', 'registered', { location: 'Shop, bay 2' })).toBe('Taken into the fleet at Shop, bay 2');
    expect(historyLine('custody', 'moved', {})).toBe('Moved to no recorded location');
    expect(historyLine('custody', 'returned', {})).toBe('Returned');
  });

  it('lists a status move once: the audit line of a custody move repeats it', () => {
    for (const kind of custodyKinds) expect(repeatsCustody(`asset.${kind}`)).toBe(true);
    expect(repeatsCustody('asset.created')).toBe(true);
    for (const action of ['asset.updated', 'asset.hold_reason_added', 'check.recorded', 'incident.reported', 'impact_review.opened']) {
      expect(repeatsCustody(action)).toBe(false);
    }
  });

  it('words the audit lines a reader meets', () => {
    const lines = [
      historyLine('audit', 'asset.updated', { changes: { serialNumber: {}, location: {} } }),
      historyLine('audit', 'asset.hold_reason_added', { summary: 'Failed its two-face check' }),
      historyLine('audit', 'check.recorded', { kind: 'tip_validation', position: 'vertical', decision: 'fail' }),
      historyLine('audit', 'incident.reported', { kind: 'impact' }),
      historyLine('audit', 'impact_review.opened', { bookings: 1 }),
      historyLine('audit', 'impact_review.assessed', { assessment: 'customer_notified' }),
      historyLine('audit', 'calibration.recorded', { asFound: 'out_of_tolerance' }),
      historyLine('audit', 'calibration.interval_declined', {}),
      historyLine('audit', 'something.new_kind', {}),
    ];
    expect(lines).toEqual([
      'Record changed: serial number, location',
      'Another reason to keep it on hold: Failed its two-face check',
      'Tip validation (vertical position) recorded: failed',
      'Damage reported: Knocked or hit',
      'Impact review opened: 1 job to assess',
      'Impact review: a job assessed, customer notified',
      'Calibration recorded: as found out of tolerance',
      'Suggested calibration interval declined',
      'Change recorded',
    ]);
    for (const line of lines) expect(line).not.toMatch(rawCode);
  });
});
