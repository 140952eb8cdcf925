/** Notifications' surface: mail is queued in the caller's transaction and sent by the outbox job. */
export { enqueueMail, type MailAttachment } from './outbox';
export { staffAddresses } from './staff';
