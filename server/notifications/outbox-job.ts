import type { Transporter } from 'nodemailer';
import type { JobDefinition } from '../jobs/job';
import { deliverOutbox } from './outbox-sender';

export const outboxJob = (transport: Transporter, from: string): JobDefinition => ({
  name: 'deliver-outbox',
  description: 'Sends queued e-mail; retries with growing pauses while the mail server is unreachable.',
  schedule: '*/15 * * * * *',
  run: ({ db, organizationId }) => deliverOutbox(db, transport, from, organizationId),
});
