export interface MailMessage {
  id: string;
  messageId: string | null;
  from: string;
  to: string[];
  subject: string;
  text: string | null;
  html: string | null;
  /** Names, types and sizes of what was attached (the sink keeps no file contents). */
  attachments: { fileName: string; contentType: string; sizeBytes: number }[];
  receivedAt: string;
}

export interface MailPage {
  items: MailMessage[];
  total: number;
}
