import type { FieldCopyView } from '../../shared/field/views';
import type { DeskService } from '../bookings/desk.service';
import type { ChecksService } from '../checks/checks.service';
import type { Actor } from '../db/transaction';
import type { AssetsService } from '../fleet/assets.service';

/**
 * The field copy a technician's phone keeps for work without signal. It composes what the owners
 * answer (bookings: the kit I carry; fleet: the items; checks: validations and rules) and stores nothing.
 */
export class FieldService {
  constructor(private readonly owners: { desk: DeskService; assets: AssetsService; checks: ChecksService }) {}

  async copy(actor: Actor): Promise<FieldCopyView> {
    const madeAt = new Date().toISOString();
    const bookings = await this.owners.desk.mine(actor);
    const ids = [...new Set([...bookings.now, ...bookings.next].flatMap((b) => b.assetIds))];
    const items = await this.owners.assets.views(actor, ids);
    const tips = items.filter((i) => i.type === 'tip').map((i) => i.id);
    const { tipValidations, checkRules } = await this.owners.checks.fieldFacts(actor, tips);
    return { madeAt, bookings, items, tipValidations, checkRules };
  }
}
