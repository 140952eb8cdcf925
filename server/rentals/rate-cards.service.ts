import type { DataSource } from 'typeorm';
import type { z } from 'zod';
import type { Quote, RateCardView } from '../../shared/billing/views';
import type { Page } from '../../shared/lists/page';
import type { quoteQuery, rateCardPayload } from '../../shared/schemas/rentals';
import { recordAudit } from '../audit/audit.service';
import { inOrganization, readInOrganization, type Actor } from '../db/transaction';
import { getKit } from '../fleet';
import { conflict } from '../http/errors';
import { listReply } from '../http/list-reply';
import { getCustomer } from './rental-records';
import { priceRental } from './pricing';
import { RateCard } from './rate-card.entity';

type RateCardInput = z.infer<typeof rateCardPayload>;

/** Rate cards per asset type and per kit, and the quotes priced from them. */
export class RateCardsService {
  constructor(private readonly db: DataSource) {}

  list(actor: Actor): Promise<Page<RateCardView>> {
    return inOrganization(this.db, actor.organizationId, async (tx) => listReply(await tx.find(RateCard, { order: { assetType: 'ASC' } })));
  }

  save(actor: Actor, input: RateCardInput, id?: string): Promise<RateCardView> {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      if (input.kitId) await getKit(tx, input.kitId);
      const subject = input.kitId ? { kitId: input.kitId } : { assetType: input.assetType! };
      const clash = await tx.findOne(RateCard, subject);
      if (clash && clash.id !== id)
        throw conflict('That type or kit already has a rate card; change that one.', {
          fields: { [input.kitId ? 'kitId' : 'assetType']: 'already has a rate card' },
        });
      const values = {
        assetType: input.assetType ?? null,
        kitId: input.kitId ?? null,
        dayMinor: input.dayMinor,
        weekMinor: input.weekMinor,
        monthMinor: input.monthMinor,
        lateFeePerDayMinor: input.lateFeePerDayMinor,
      };
      const card = id ? await tx.save(RateCard, Object.assign(await tx.get(RateCard, { id }, 'That rate card'), values)) : await tx.insert(RateCard, values);
      await recordAudit(tx, actor, 'rate_card.saved', { type: 'rate_card', id: card.id }, values);
      return card;
    });
  }

  /** Prices a rental at today's rate cards (for a customer, when one is named). */
  quote(actor: Actor, q: z.infer<typeof quoteQuery>): Promise<Quote> {
    return readInOrganization(this.db, actor.organizationId, async (tx) => {
      if (q.customerId) await getCustomer(tx, q.customerId);
      return priceRental(tx, q);
    });
  }
}
