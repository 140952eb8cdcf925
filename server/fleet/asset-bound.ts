import { Column, JoinColumn, ManyToOne } from 'typeorm';
import { OrgOwned } from '../db/org-owned';
import type { AssetRecord } from './asset-records';
import { Asset } from './asset.entity';

/** A record about one asset (a check, a hold, an incident, a calibration…): the
 * asset's id with a foreign key that refuses to lose the history. */
export abstract class AssetBound extends OrgOwned {
  @Column({ name: 'asset_id', type: 'uuid' })
  assetId: string;

  @ManyToOne(() => Asset, { onDelete: 'RESTRICT', nullable: false })
  @JoinColumn({ name: 'asset_id' })
  asset?: AssetRecord;
}
