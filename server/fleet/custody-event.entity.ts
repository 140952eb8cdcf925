import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { AssetBound } from './asset-bound';

import type { CustodyKind } from '../../shared/assets/record-words';

export type { CustodyKind };

/** Append-only chain of custody: who had an item, where, from when (DESIGN.md §3).
 * The database refuses UPDATE and DELETE on this table. */
@Entity({ name: 'custody_events' })
@Index(['organizationId', 'assetId', 'at'])
export class CustodyEvent extends AssetBound {
  @PrimaryGeneratedColumn('identity', { type: 'bigint' })
  id: string;

  @Column({ type: 'text' })
  kind: CustodyKind;

  @Column({ name: 'actor_user_id', type: 'uuid', nullable: true })
  actorUserId: string | null;

  /** Who holds the item after this event (a person, a customer, a lab). */
  @Column({ name: 'holder', type: 'text', nullable: true })
  holder: string | null;

  @Column({ type: 'text', nullable: true })
  location: string | null;

  @Column({ name: 'booking_id', type: 'uuid', nullable: true })
  bookingId: string | null;

  @Column({ type: 'text', nullable: true })
  note: string | null;

  @CreateDateColumn({ name: 'at', type: 'timestamptz' })
  at: Date;
}
