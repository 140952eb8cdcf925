import { Column, Entity, Index, PrimaryGeneratedColumn } from 'typeorm';
import { OrgOwned } from '../db/org-owned';
import type { AssetType } from '../../shared/assets/vocabulary';

/** Rental rates for an asset type, or for a whole kit (which then rents as one line). */
@Entity({ name: 'rate_cards' })
@Index(['organizationId', 'assetType'], { unique: true, where: '"asset_type" IS NOT NULL' })
@Index(['organizationId', 'kitId'], { unique: true, where: '"kit_id" IS NOT NULL' })
export class RateCard extends OrgOwned {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'asset_type', type: 'text', nullable: true })
  assetType: AssetType | null;

  @Column({ name: 'kit_id', type: 'uuid', nullable: true })
  kitId: string | null;

  @Column({ name: 'day_minor', type: 'integer' })
  dayMinor: number;

  @Column({ name: 'week_minor', type: 'integer' })
  weekMinor: number;

  @Column({ name: 'month_minor', type: 'integer' })
  monthMinor: number;

  @Column({ name: 'late_fee_per_day_minor', type: 'integer' })
  lateFeePerDayMinor: number;
}
