import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { OrgOwned } from '../db/org-owned';
import type { LabTripState } from '../../shared/calibration/views';
import { AssetBound } from '../fleet';

/** Items sent together to a calibration provider. */
@Entity({ name: 'lab_trips' })
@Index(['organizationId', 'state'])
export class LabTrip extends OrgOwned {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'text' })
  provider: string;

  @Column({ name: 'sent_on', type: 'date' })
  sentOn: string;

  @Column({ name: 'expected_back_on', type: 'date' })
  expectedBackOn: string;

  @Column({ type: 'text' })
  state: LabTripState;

  /** The lab booking that keeps the window free on the board. */
  @Column({ name: 'booking_id', type: 'uuid', nullable: true })
  bookingId: string | null;

  @Column({ name: 'created_by', type: 'uuid' })
  createdBy: string;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;
}

@Entity({ name: 'lab_trip_items' })
@Index(['organizationId', 'assetId'])
export class LabTripItem extends AssetBound {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Index()
  @Column({ name: 'lab_trip_id', type: 'uuid' })
  labTripId: string;

  @ManyToOne(() => LabTrip, { onDelete: 'CASCADE', nullable: false })
  @JoinColumn({ name: 'lab_trip_id' })
  labTrip?: LabTrip;

  @Column({ name: 'received_on', type: 'date', nullable: true })
  receivedOn: string | null;

  @Column({ name: 'calibration_event_id', type: 'uuid', nullable: true })
  calibrationEventId: string | null;
}
