import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { OrgOwned } from '../db/org-owned';
import { Rental } from './rental.entity';

/**
 * The renter's way to their rental's page without signing in: only the
 * SHA-256 of the link's secret is kept, so the table alone opens nothing.
 * A new link revokes the ones before it.
 */
@Entity({ name: 'renter_links' })
@Index(['organizationId', 'rentalId'])
export class RenterLink extends OrgOwned {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'rental_id', type: 'uuid' })
  rentalId: string;

  @ManyToOne(() => Rental, { onDelete: 'CASCADE', nullable: false })
  @JoinColumn({ name: 'rental_id' })
  rental?: Rental;

  @Index({ unique: true })
  @Column({ name: 'token_sha256', type: 'text' })
  tokenSha256: string;

  @Column({ name: 'expires_at', type: 'timestamptz' })
  expiresAt: Date;

  @Column({ name: 'revoked_at', type: 'timestamptz', nullable: true })
  revokedAt: Date | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;
}

/** The renter's acceptance of the rental agreement: who typed their name, when, from which address, and the SHA-256 of the exact PDF they accepted. */
@Entity({ name: 'agreement_acceptances' })
@Index(['organizationId', 'rentalId'])
export class AgreementAcceptance extends OrgOwned {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'rental_id', type: 'uuid' })
  rentalId: string;

  @ManyToOne(() => Rental, { onDelete: 'RESTRICT', nullable: false })
  @JoinColumn({ name: 'rental_id' })
  rental?: Rental;

  @Column({ name: 'renter_link_id', type: 'uuid' })
  renterLinkId: string;

  @ManyToOne(() => RenterLink, { onDelete: 'RESTRICT', nullable: false })
  @JoinColumn({ name: 'renter_link_id' })
  renterLink?: RenterLink;

  @Column({ name: 'full_name', type: 'text' })
  fullName: string;

  @Column({ name: 'ip_address', type: 'text' })
  ipAddress: string;

  @Column({ name: 'user_agent', type: 'text', nullable: true })
  userAgent: string | null;

  @Column({ name: 'agreement_sha256', type: 'text' })
  agreementSha256: string;

  /** The exact bytes accepted, so the record can show what was agreed. */
  @Column({ name: 'agreement_pdf', type: 'bytea', select: false })
  agreementPdf?: Buffer;

  @CreateDateColumn({ name: 'accepted_at', type: 'timestamptz' })
  acceptedAt: Date;
}
