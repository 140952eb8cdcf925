import { DateTime } from 'luxon';
import { describe, expect, it } from 'vitest';
import { backupsToDelete, type BackupFile } from './retention';

/** One backup a night at 02:30 UTC from `from` for `nights` nights. */
function nightly(from: string, nights: number): BackupFile[] {
  const start = DateTime.fromISO(`${from}T02:30:00Z`, { zone: 'utc' });
  return Array.from({ length: nights }, (_, i) => ({ name: `n${i}`, takenAt: start.plus({ days: i }).toJSDate() }));
}
const kept = (all: BackupFile[], now: string, daily: number, weekly: number) => {
  const gone = new Set(backupsToDelete(all, { daily, weekly }, new Date(now)));
  return all.filter((b) => !gone.has(b)).map((b) => b.takenAt.toISOString().slice(0, 10));
};

describe('backup retention (14 daily, 8 weekly)', () => {
  it('keeps the last 14 nights and the newest backup of each of the 8 ISO weeks back to 8 weeks ago', () => {
    // 2026-12-03 is a Thursday; ISO 8601 weeks start on Monday (luxon's weeks are ISO weeks: an independent reference).
    const all = nightly('2026-08-01', 125); // to 2026-12-03
    const now = '2026-12-03T12:00:00Z';
    const result = kept(all, now, 14, 8);
    const lastFourteen = Array.from({ length: 14 }, (_, i) =>
      DateTime.fromISO('2026-12-03', { zone: 'utc' })
        .minus({ days: 13 - i })
        .toISODate(),
    );
    expect(result).toEqual(expect.arrayContaining(lastFourteen));
    // Weekly: the Sunday (last night of its ISO week) of each earlier week, found with luxon's ISO week arithmetic.
    const thisWeek = DateTime.fromISO(now, { zone: 'utc' }).startOf('week');
    const weeklies = Array.from({ length: 7 }, (_, i) =>
      thisWeek
        .minus({ weeks: i + 1 })
        .endOf('week')
        .toISODate(),
    );
    expect(result).toEqual(expect.arrayContaining(weeklies));
    expect(new Set(result).size).toBe(new Set([...lastFourteen, ...weeklies]).size);
    expect(result.length).toBe(new Set([...lastFourteen, ...weeklies]).size);
    expect(result[0]).toBe('2026-10-18'); // Sunday of ISO week 42 (2026-W42 runs 12–18 October): the 8th week back, counting this one
  });

  it('keeps only the newest of several backups on one day; a day without backups still counts (no stretching back)', () => {
    const day = (iso: string, name: string) => ({ name, takenAt: new Date(iso) });
    const all = [day('2026-12-01T02:30:00Z', 'a'), day('2026-12-01T15:00:00Z', 'b'), day('2026-11-20T02:30:00Z', 'old')];
    const gone = backupsToDelete(all, { daily: 3, weekly: 0 }, new Date('2026-12-03T09:00:00Z')).map((b) => b.name);
    expect(gone.sort()).toEqual(['a', 'old']);
  });

  it('weeks span a year end as ISO 8601 says: 2026-12-31 (Thursday) and 2027-01-03 (Sunday) are one week, 2026-W53', () => {
    expect(DateTime.fromISO('2027-01-03', { zone: 'utc' }).weekNumber).toBe(53); // the reference agrees with the claim
    const all = [
      { name: 'thu', takenAt: new Date('2026-12-31T02:30:00Z') },
      { name: 'sun', takenAt: new Date('2027-01-03T02:30:00Z') },
    ];
    const gone = backupsToDelete(all, { daily: 1, weekly: 2 }, new Date('2027-01-06T12:00:00Z')).map((b) => b.name);
    expect(gone).toEqual(['thu']);
  });

  it('never deletes a backup dated after now (a clock set wrong)', () => {
    const all = [{ name: 'future', takenAt: new Date('2027-06-01T00:00:00Z') }];
    expect(backupsToDelete(all, { daily: 1, weekly: 0 }, new Date('2026-12-03T00:00:00Z'))).toEqual([]);
  });
});
