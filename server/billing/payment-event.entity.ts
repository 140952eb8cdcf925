import { Column, CreateDateColumn, Entity, PrimaryColumn } from 'typeorm';

/** Each provider webhook event, by its id: the primary key is what makes a re-delivery a no-op. */
@Entity({ name: 'payment_events' })
export class PaymentEvent {
  @PrimaryColumn({ name: 'event_id', type: 'text' })
  eventId: string;

  @Column({ type: 'text' })
  type: string;

  @Column({ name: 'organization_id', type: 'uuid', nullable: true })
  organizationId: string | null;

  /** What the event changed here, in words, for the record. */
  @Column({ type: 'text' })
  outcome: string;

  @CreateDateColumn({ name: 'received_at', type: 'timestamptz' })
  receivedAt: Date;
}
