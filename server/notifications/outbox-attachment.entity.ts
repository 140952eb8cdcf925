import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { OutboxMessage } from './outbox-message.entity';

/** A file sent with an outbox message (an agreement, a certificate pack, an invoice), kept with it until delivery. */
@Entity({ name: 'outbox_attachments' })
@Index(['messageId'])
export class OutboxAttachment {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'message_id', type: 'uuid' })
  messageId: string;

  @ManyToOne(() => OutboxMessage, { onDelete: 'CASCADE', nullable: false })
  @JoinColumn({ name: 'message_id' })
  message?: OutboxMessage;

  @Column({ name: 'file_name', type: 'text' })
  fileName: string;

  @Column({ name: 'content_type', type: 'text' })
  contentType: string;

  @Column({ type: 'bytea' })
  content: Buffer;
}
