import { DEFAULT_DUE_SOON_DAYS, todayIn } from '../../shared/calibration/due-date';
import type { Scoped } from '../db/scoped';
import { Organization } from './organization.entity';

/** The organization facts most rules need: its calendar "today", due-soon window, currency. */
export type OrgContext = { id: string; name: string; timeZone: string; currency: string; dueSoonDays: number; today: string };

export async function loadOrgContext(tx: Scoped, now: Date = new Date()): Promise<OrgContext> {
  const org = await tx.manager.findOneByOrFail(Organization, { id: tx.organizationId });
  return {
    id: org.id,
    name: org.name,
    timeZone: org.timeZone,
    currency: org.currency,
    dueSoonDays: org.settings.dueSoonDays ?? DEFAULT_DUE_SOON_DAYS,
    today: todayIn(org.timeZone, now),
  };
}
