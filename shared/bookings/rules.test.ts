import { DateTime, Interval } from 'luxon';
import { describe, expect, it } from 'vitest';
import { blockReason, bookingDays, rangesOverlap } from './rules';

const asset = (over: object = {}) => ({ type: 'tracker' as const, status: 'ready' as const, calibration: { required: true, dueOn: '2026-12-20' }, ...over });

describe('booking rules (DESIGN.md §4.1)', () => {
  it('accepts calibration due on the last day of the booking and refuses due the day before', () => {
    expect(blockReason(asset(), '2026-12-20')).toBeNull();
    expect(blockReason(asset(), '2026-12-21')).toBe('calibration_expires');
    expect(blockReason(asset({ calibration: { required: true, dueOn: null } }), '2026-12-01')).toBe('calibration_expires');
    expect(blockReason(asset({ calibration: { required: false, dueOn: null } }), '2030-01-01')).toBeNull();
  });

  it('refuses held, retired and at-lab items, and tips without a passing validation', () => {
    expect(blockReason(asset({ status: 'held' }), '2026-12-02')).toBe('held');
    expect(blockReason(asset({ status: 'retired' }), '2026-12-02')).toBe('retired');
    expect(blockReason(asset({ status: 'at_lab' }), '2026-12-02')).toBe('at_lab');
    expect(blockReason(asset({ type: 'tip', tipValidated: false }), '2026-12-02')).toBe('tip_not_validated');
    expect(blockReason(asset({ type: 'tip', tipValidated: true }), '2026-12-02')).toBeNull();
  });

  it('lets a lab trip take what may not go out on a job, except a retired item', () => {
    for (const over of [{ status: 'held' }, { status: 'at_lab' }, { calibration: { required: true, dueOn: null } }, { type: 'tip', tipValidated: false }]) {
      expect(blockReason(asset(over), '2027-01-31', 'lab')).toBeNull();
    }
    expect(blockReason(asset({ status: 'retired' }), '2027-01-31', 'lab')).toBe('retired');
  });

  it('counts whole days with both ends included (checked with Luxon intervals)', () => {
    expect(bookingDays('2026-12-01', '2026-12-01')).toBe(1);
    expect(bookingDays('2026-12-01', '2026-12-14')).toBe(14);
    const luxonDays = Interval.fromDateTimes(DateTime.fromISO('2026-02-20'), DateTime.fromISO('2026-03-06').plus({ days: 1 })).length('days');
    expect(bookingDays('2026-02-20', '2026-03-06')).toBe(luxonDays);
  });

  it('treats back-to-back bookings as free and a shared day as an overlap', () => {
    expect(rangesOverlap({ startsOn: '2026-12-01', endsOn: '2026-12-14' }, { startsOn: '2026-12-15', endsOn: '2026-12-20' })).toBe(false);
    expect(rangesOverlap({ startsOn: '2026-12-01', endsOn: '2026-12-14' }, { startsOn: '2026-12-14', endsOn: '2026-12-20' })).toBe(true);
    expect(rangesOverlap({ startsOn: '2026-12-05', endsOn: '2026-12-06' }, { startsOn: '2026-12-01', endsOn: '2026-12-31' })).toBe(true);
  });
});
