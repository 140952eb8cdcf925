import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import type { Role } from '../../shared/auth/roles';
import { OrgOwned } from '../db/org-owned';

export type AccountLinkPurpose = 'invitation' | 'password_reset';

/**
 * A single-use link mailed to a person: an invitation to join the firm (72 h) or a
 * password reset (1 h). Only the SHA-256 of the link's secret is kept, so a copy of
 * the database opens no account.
 */
@Entity({ name: 'account_links' })
export class AccountLink extends OrgOwned {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'text' })
  purpose: AccountLinkPurpose;

  /** Hex SHA-256 of the secret in the mailed link. */
  @Index({ unique: true })
  @Column({ name: 'token_hash', type: 'text' })
  tokenHash: string;

  /** Where the link was sent (the invitee's future sign-in name). */
  @Column({ type: 'text' })
  email: string;

  /** The role an invitation grants; null for a reset. */
  @Column({ type: 'text', nullable: true })
  role: Role | null;

  /** A reset's person, or an accepted invitation's new person. */
  @Column({ name: 'user_id', type: 'uuid', nullable: true })
  userId: string | null;

  @ManyToOne('User', { onDelete: 'CASCADE', nullable: true })
  @JoinColumn({ name: 'user_id' })
  user?: unknown;

  /** Who sent an invitation; null for a reset the person asked for. */
  @Column({ name: 'created_by', type: 'uuid', nullable: true })
  createdBy: string | null;

  @Column({ name: 'expires_at', type: 'timestamptz' })
  expiresAt: Date;

  @Column({ name: 'used_at', type: 'timestamptz', nullable: true })
  usedAt: Date | null;

  @Column({ name: 'withdrawn_at', type: 'timestamptz', nullable: true })
  withdrawnAt: Date | null;

  /** The last time the link was mailed (an invitation can be sent again). */
  @Column({ name: 'sent_at', type: 'timestamptz' })
  sentAt: Date;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;
}
