import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { OrgOwned } from '../db/org-owned';

/**
 * One request to the renter to place the deposit's card authorization on the
 * provider's hosted page (a Checkout Session). `open` until the provider's
 * signed event says the card is authorized (`complete`) or the session ends
 * (`expired`); a newer request for the same rental `replaced` it.
 */
@Entity({ name: 'deposit_requests' })
@Index(['organizationId', 'rentalId'])
export class DepositRequest extends OrgOwned {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'rental_id', type: 'uuid' })
  rentalId: string;

  // Rentals' row, named rather than imported: billing reads rentals through server/rentals.
  @ManyToOne('Rental', { onDelete: 'RESTRICT', nullable: false })
  @JoinColumn({ name: 'rental_id' })
  rental?: object;

  @Index({ unique: true })
  @Column({ name: 'checkout_session_id', type: 'text' })
  checkoutSessionId: string;

  /** The provider's hosted page for this session. */
  @Column({ type: 'text' })
  url: string;

  @Column({ name: 'expires_at', type: 'timestamptz' })
  expiresAt: Date;

  @Column({ type: 'text' })
  state: 'open' | 'complete' | 'expired' | 'replaced';

  /** The Idempotency-Key the provider saw when the session was created. */
  @Index({ unique: true })
  @Column({ name: 'idempotency_key', type: 'text' })
  idempotencyKey: string;

  @Column({ name: 'sent_to', type: 'text' })
  sentTo: string;

  /** The provider's words on the renter's last declined card, while the session is still open. */
  @Column({ name: 'decline_message', type: 'text', nullable: true })
  declineMessage: string | null;

  @Column({ name: 'requested_by', type: 'uuid' })
  requestedBy: string;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;
}
