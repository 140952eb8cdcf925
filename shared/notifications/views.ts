/** What the mailbox API answers. Plain types, no zod: the browser imports them as types only. */

/** A message the local SMTP sink received from this firm. */
export type MailMessageView = {
  id: string;
  messageId: string | null;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string | null;
  /** Names, types and sizes of what was attached (the sink keeps no file contents). */
  attachments: { fileName: string; contentType: string; sizeBytes: number }[];
  receivedAt: string;
};
