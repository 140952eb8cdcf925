import { Column, Entity, Index, PrimaryColumn } from 'typeorm';

/** Failed sign-in attempts per address and e-mail in the current window, shared by every app instance. */
@Entity({ name: 'login_attempts' })
export class LoginAttempt {
  @PrimaryColumn({ type: 'text' })
  key: string;

  @Column({ type: 'integer' })
  hits: number;

  @Index()
  @Column({ name: 'resets_at', type: 'timestamptz' })
  resetsAt: Date;
}
