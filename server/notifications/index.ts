/** Notifications' surface: mail is queued in the caller's transaction and sent by the deliver-outbox routine. */
import { OutboxAttachment } from './outbox-attachment.entity';
import { OutboxMessage } from './outbox-message.entity';
import { SinkMessage } from './sink-message.entity';

export const notificationEntities = [OutboxMessage, OutboxAttachment, SinkMessage];
export { draftLetter, enqueueMail, firmSignature, mailDeliveries, outboxBacklog, type MailAttachment } from './outbox';
export { letterTemplate, mailTemplate, type MailTemplate } from './mail-template';
export { staffAddresses } from './staff';
