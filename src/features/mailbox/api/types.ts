export interface MailMessage {
  id: string;
  messageId: string | null;
  from: string;
  to: string[];
  subject: string;
  text: string | null;
  html: string | null;
  receivedAt: string;
}

export interface MailPage {
  items: MailMessage[];
  total: number;
}
