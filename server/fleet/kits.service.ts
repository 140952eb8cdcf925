import { In, Not, type DataSource } from 'typeorm';
import { calibrationState } from '../../shared/calibration/due-date';
import type { KitReadiness, KitView, KitWithMembersView } from '../../shared/assets/views';
import type { Page } from '../../shared/lists/page';
import { recordAudit } from '../audit/audit.service';
import type { Scoped } from '../db/scoped';
import { inOrganization, type Actor } from '../db/transaction';
import { conflict, notFound, ruleBroken } from '../http/errors';
import { loadOrgContext, type OrgContext } from '../organizations';
import { Asset } from './asset.entity';
import { toAssetView } from './asset-view';
import { Kit } from './kit.entity';

const isUniqueViolation = (err: unknown) => (err as { code?: string })?.code === '23505';

/** A kit is ready only when every member is ready and inside its calibration period. */
export function kitReadiness(members: Asset[], ctx: OrgContext): KitReadiness {
  const reasons: KitReadiness['reasons'] = [];
  for (const m of members) {
    if (m.status !== 'ready') reasons.push({ assetId: m.id, assetTag: m.assetTag, reason: 'not_ready' });
    else if (calibrationState(m.calibrationRequired, m.dueOn, ctx.today, ctx.dueSoonDays) === 'overdue') {
      reasons.push({ assetId: m.id, assetTag: m.assetTag, reason: 'calibration_overdue' });
    }
  }
  return { ready: members.length > 0 && reasons.length === 0, reasons };
}

export class KitsService {
  constructor(
    private readonly db: DataSource,
    private readonly publicUrl: string,
  ) {}

  private view(kit: Kit, members: Asset[], ctx: OrgContext): KitView {
    return {
      id: kit.id,
      name: kit.name,
      notes: kit.notes,
      memberCount: members.length,
      readiness: kitReadiness(members, ctx),
      createdAt: kit.createdAt.toISOString(),
      updatedAt: kit.updatedAt.toISOString(),
    };
  }

  list(actor: Actor, paging: { limit: number; offset: number }): Promise<Page<KitView>> {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const ctx = await loadOrgContext(tx);
      const [kits, total] = await tx.findAndCount(Kit, { order: { name: 'ASC' }, take: paging.limit, skip: paging.offset });
      const members = kits.length ? await tx.find(Asset, { where: { kitId: In(kits.map((k) => k.id)) } }) : [];
      return {
        items: kits.map((k) =>
          this.view(
            k,
            members.filter((m) => m.kitId === k.id),
            ctx,
          ),
        ),
        total,
      };
    });
  }

  get(actor: Actor, id: string) {
    return inOrganization(this.db, actor.organizationId, (tx) => this.load(tx, id));
  }

  private async load(tx: Scoped, id: string, ctx?: OrgContext): Promise<KitWithMembersView> {
    const kit = await tx.get(Kit, { id }, 'That kit');
    const members = await tx.find(Asset, { where: { kitId: id }, order: { type: 'ASC', assetTag: 'ASC' } });
    const context = ctx ?? (await loadOrgContext(tx));
    return { ...this.view(kit, members, context), members: members.map((m) => toAssetView(Object.assign(m, { kit }), context, this.publicUrl)) };
  }

  create(actor: Actor, input: { name: string; notes?: string | null; memberIds?: string[] }) {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      if (await tx.count(Kit, { name: input.name }))
        throw conflict(`There is already a kit called "${input.name}".`, { fields: { name: 'is already used by another kit' } });
      const kit = await tx.insert(Kit, { name: input.name, notes: input.notes ?? null }).catch((err) => {
        throw isUniqueViolation(err) ? conflict(`There is already a kit called "${input.name}".`) : err;
      });
      if (input.memberIds?.length) await this.setMembers(tx, kit, input.memberIds);
      await recordAudit(tx, actor, 'kit.created', { type: 'kit', id: kit.id }, { name: kit.name, memberIds: input.memberIds ?? [] });
      return this.load(tx, kit.id);
    });
  }

  update(actor: Actor, id: string, patch: { name?: string; notes?: string | null; memberIds?: string[] }) {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const kit = await tx.get(Kit, { id }, 'That kit');
      const before = { name: kit.name, notes: kit.notes };
      if (patch.name && patch.name !== kit.name) {
        if (await tx.count(Kit, { name: patch.name, id: Not(id) }))
          throw conflict(`There is already a kit called "${patch.name}".`, { fields: { name: 'is already used by another kit' } });
        kit.name = patch.name;
      }
      if (patch.notes !== undefined) kit.notes = patch.notes;
      await tx.save(Kit, kit);
      const membership = patch.memberIds ? await this.setMembers(tx, kit, patch.memberIds) : null;
      await recordAudit(tx, actor, 'kit.updated', { type: 'kit', id }, { before, after: { name: kit.name, notes: kit.notes }, ...(membership ?? {}) });
      return this.load(tx, id);
    });
  }

  /** Replace the packing list. An asset is in at most one kit: taking one from another kit is a 409 naming it. */
  private async setMembers(tx: Scoped, kit: Kit, memberIds: string[]) {
    const wanted = [...new Set(memberIds)];
    const assets = await tx.getEach(Asset, wanted, 'Asset', { relations: { kit: true } });
    const retired = assets.filter((a) => a.status === 'retired');
    if (retired.length) throw ruleBroken('asset_retired', `Retired items cannot join a kit: ${retired.map((a) => a.assetTag).join(', ')}.`);
    const elsewhere = assets.filter((a) => a.kitId && a.kitId !== kit.id);
    if (elsewhere.length) {
      throw conflict(`Already in another kit: ${elsewhere.map((a) => `${a.assetTag} (${a.kit?.name})`).join(', ')}. Take them out of that kit first.`, {
        conflicts: elsewhere.map((a) => ({ assetId: a.id, assetTag: a.assetTag, kitId: a.kitId, kitName: a.kit?.name })),
      });
    }
    const current = await tx.find(Asset, { where: { kitId: kit.id } });
    const removed = current.filter((a) => !wanted.includes(a.id)).map((a) => a.id);
    const added = wanted.filter((id) => !current.some((a) => a.id === id));
    if (removed.length) await tx.updateWhere(Asset, { id: In(removed) }, { kitId: null });
    if (added.length) await tx.updateWhere(Asset, { id: In(added) }, { kitId: kit.id });
    return { added, removed };
  }
}
