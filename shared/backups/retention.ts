/** How many backups to keep: the newest of each of the last `daily` days and of the last `weekly` ISO weeks. */
export type RetentionPolicy = { daily: number; weekly: number };

export type BackupFile = { name: string; takenAt: Date };

const DAY_MS = 86_400_000;

/** The UTC calendar day of an instant, as days since 1970-01-01. */
const dayNumber = (t: Date) => Math.floor(t.getTime() / DAY_MS);

/** The ISO 8601 week (weeks start on Monday) of a UTC day, as the day number of its Monday. 1970-01-01 was a Thursday. */
const weekNumber = (t: Date) => {
  const day = dayNumber(t);
  return day - ((day + 3) % 7);
};

/**
 * Which backups to delete. A day (or week) is one of the last `daily` (`weekly`) counted back from `now`'s, whether or
 * not a backup was taken on it, so missed nights do not stretch how far back is kept. In each kept day and week the
 * newest backup stays; everything else goes. Backups from the future (a clock set wrong) are kept.
 */
export function backupsToDelete(backups: BackupFile[], policy: RetentionPolicy, now: Date): BackupFile[] {
  const keep = new Set<BackupFile>();
  const newestIn = (bucketOf: (t: Date) => number, first: number, last: number) => {
    const newest = new Map<number, BackupFile>();
    for (const b of backups) {
      const bucket = bucketOf(b.takenAt);
      if (bucket < first || bucket > last) continue;
      const held = newest.get(bucket);
      if (!held || b.takenAt > held.takenAt) newest.set(bucket, b);
    }
    for (const b of newest.values()) keep.add(b);
  };
  const today = dayNumber(now);
  const thisWeek = weekNumber(now);
  newestIn(dayNumber, today - policy.daily + 1, today);
  if (policy.weekly > 0) newestIn(weekNumber, thisWeek - 7 * (policy.weekly - 1), thisWeek);
  return backups.filter((b) => !keep.has(b) && b.takenAt <= now);
}
