import type { DataSource } from 'typeorm';
import type { z } from 'zod';
import type { OrganizationSettingsView } from '../../shared/organizations/views';
import type { organizationSettingsPayload } from '../../shared/schemas/assets';
import { recordAudit } from '../audit/audit.service';
import { inOrganization, type Actor } from '../db/transaction';
import { loadOrgContext } from './org-context';
import { Organization } from './organization.entity';

const view = (ctx: Awaited<ReturnType<typeof loadOrgContext>>): OrganizationSettingsView => ({
  name: ctx.name,
  locale: ctx.locale,
  timeZone: ctx.timeZone,
  mailReplyTo: ctx.mailReplyTo,
  currency: ctx.currency,
  dueSoonDays: ctx.dueSoonDays,
  checkoutOpensDaysBefore: ctx.checkoutOpensDaysBefore,
  decisionRule: ctx.decisionRule,
  triageRatio: ctx.triageRatio,
  tolerances: ctx.tolerances,
  taxRateBasisPoints: ctx.taxRateBasisPoints,
  depositPolicy: ctx.depositPolicy,
  providers: ctx.providers,
  intervalPolicy: ctx.intervalPolicy,
  issuer: ctx.issuer,
  secondStepRequired: ctx.secondStepRequired,
});

export const getSettings = (db: DataSource, actor: Actor) => inOrganization(db, actor.organizationId, async (tx) => view(await loadOrgContext(tx)));

export function updateSettings(db: DataSource, actor: Actor, patch: z.infer<typeof organizationSettingsPayload>) {
  return inOrganization(db, actor.organizationId, async (tx) => {
    const org = await tx.manager.findOneByOrFail(Organization, { id: actor.organizationId });
    const before = { timeZone: org.timeZone, ...org.settings };
    if (patch.timeZone) org.timeZone = patch.timeZone;
    if (patch.dueSoonDays !== undefined) org.settings = { ...org.settings, dueSoonDays: patch.dueSoonDays };
    if (patch.triageRatio !== undefined) org.settings = { ...org.settings, triageRatio: patch.triageRatio };
    if (patch.checkoutOpensDaysBefore !== undefined) org.settings = { ...org.settings, checkoutOpensDaysBefore: patch.checkoutOpensDaysBefore };
    if (patch.decisionRule) org.settings = { ...org.settings, decisionRule: patch.decisionRule };
    if (patch.taxRateBasisPoints !== undefined) org.settings = { ...org.settings, taxRateBasisPoints: patch.taxRateBasisPoints };
    if (patch.depositPolicy) org.settings = { ...org.settings, depositPolicy: patch.depositPolicy };
    if (patch.providers) org.settings = { ...org.settings, providers: patch.providers };
    if (patch.intervalPolicy) org.settings = { ...org.settings, intervalPolicy: patch.intervalPolicy };
    if (patch.issuer) org.settings = { ...org.settings, issuer: { ...org.settings.issuer, ...patch.issuer } };
    if (patch.locale) org.settings = { ...org.settings, locale: patch.locale };
    if (patch.mailReplyTo !== undefined) org.settings = { ...org.settings, mailReplyTo: patch.mailReplyTo };
    if (patch.secondStepRequired !== undefined) org.settings = { ...org.settings, secondStepRequired: patch.secondStepRequired };
    if (patch.tolerances) org.settings = { ...org.settings, tolerances: { ...org.settings.tolerances, ...patch.tolerances } };
    await tx.manager.save(Organization, org);
    await recordAudit(tx, actor, 'settings.updated', { type: 'organization', id: org.id }, { before, after: patch });
    return view(await loadOrgContext(tx));
  });
}
