import type { Transporter } from 'nodemailer';
import type { Routine } from '../routines';
import { deliverOutbox } from './outbox-sender';

export const outboxRoutine = (transport: Transporter, from: string): Routine => ({
  name: 'deliver-outbox',
  description: 'Sends queued e-mail; retries with growing pauses while the mail server is unreachable.',
  schedule: '*/15 * * * * *',
  run: ({ db, organizationId }) => deliverOutbox(db, transport, from, organizationId),
});
