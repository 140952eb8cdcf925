import { Column, Entity, PrimaryGeneratedColumn } from 'typeorm';

/** What the local SMTP sink received (server/fakes/smtp-sink.ts). Not owned by
 * an organization: the mailbox joins it to the outbox by Message-ID to scope it. */
@Entity({ name: 'mail_sink_messages' })
export class SinkMessage {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'message_id', type: 'text', nullable: true, unique: true })
  messageId: string | null;

  @Column({ name: 'envelope_from', type: 'text' })
  envelopeFrom: string;

  @Column({ type: 'text', array: true })
  recipients: string[];

  @Column({ type: 'text' })
  subject: string;

  @Column({ name: 'text_body', type: 'text' })
  textBody: string;

  @Column({ name: 'html_body', type: 'text', nullable: true })
  htmlBody: string | null;

  @Column({ type: 'jsonb' })
  headers: Record<string, string>;

  @Column({ type: 'jsonb', nullable: true })
  attachments: { fileName: string; contentType: string; sizeBytes: number }[] | null;

  @Column({ name: 'received_at', type: 'timestamptz' })
  receivedAt: Date;
}
