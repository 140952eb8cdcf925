import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import { OrgOwned } from '../db/org-owned';

/**
 * One sign-in: its id is the `jti` of the session token. Lets a person see where they are
 * signed in and end one session or all of them; `last_seen_at` moves at most once a minute.
 */
@Entity({ name: 'user_sessions' })
export class UserSession extends OrgOwned {
  @PrimaryColumn({ type: 'uuid' })
  id: string;

  @Index()
  @Column({ name: 'user_id', type: 'uuid' })
  userId: string;

  @ManyToOne('User', { onDelete: 'CASCADE', nullable: false })
  @JoinColumn({ name: 'user_id' })
  user?: unknown;

  /** The browser's User-Agent as sent (shortened), to tell devices apart. */
  @Column({ name: 'user_agent', type: 'text' })
  userAgent: string;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;

  @Column({ name: 'last_seen_at', type: 'timestamptz' })
  lastSeenAt: Date;

  @Column({ name: 'ended_at', type: 'timestamptz', nullable: true })
  endedAt: Date | null;
}
