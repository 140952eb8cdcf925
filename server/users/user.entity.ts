import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';
import type { Role } from '../../shared/auth/roles';
import { OrgOwned } from '../db/org-owned';

@Entity({ name: 'users' })
export class User extends OrgOwned {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  /** Sign-in name; unique across organizations because sign-in asks no firm. */
  @Index({ unique: true })
  @Column({ type: 'text' })
  email: string;

  @Column({ type: 'text' })
  name: string;

  @Column({ type: 'text' })
  role: Role;

  @Column({ name: 'password_hash', type: 'text', select: false })
  passwordHash: string;

  @Column({ type: 'boolean', default: false })
  disabled: boolean;

  /** Bumped on disable and password change so tokens issued before stop working. */
  @Column({ name: 'token_version', type: 'integer', default: 0 })
  tokenVersion: number;

  /** Secret for this person's calendar feed (`/api/calendar.ics?token=`); replaced on request. */
  @Index({ unique: true })
  @Column({ name: 'calendar_token', type: 'text', nullable: true, select: false })
  calendarToken: string | null;

  /** The TOTP secret (RFC 6238), sealed with a key derived from the installation's secret (auth/sealing.ts); set while pending too. */
  @Column({ name: 'totp_secret', type: 'text', nullable: true, select: false })
  totpSecret: string | null;

  /** When the second step was confirmed; null while it is off or only pending. */
  @Column({ name: 'totp_enabled_at', type: 'timestamptz', nullable: true })
  totpEnabledAt: Date | null;

  /** The last time step whose code was accepted: a code is good once (RFC 6238 §5.2). */
  @Column({ name: 'totp_last_step', type: 'bigint', nullable: true, select: false })
  totpLastStep: string | null;

  /** Keyed hashes of the unused recovery codes. */
  @Column({ name: 'recovery_code_hashes', type: 'jsonb', default: () => "'[]'", select: false })
  recoveryCodeHashes: string[];

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;

  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz' })
  updatedAt: Date;
}
