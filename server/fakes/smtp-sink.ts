import { simpleParser, type ParsedMail } from 'mailparser';
import type { Pool } from 'pg';
import { SMTPServer, type SMTPServerDataStream, type SMTPServerSession } from 'smtp-server';
import { listen } from './listen';
import { fakesLog } from './log';

/** One message as the sink received it: the envelope (who it was really sent
 * from and to, Bcc included) plus the parsed content. */
export type SinkMessage = {
  messageId: string | null;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string | null;
  headers: Record<string, string>;
  /** What was attached (names, types, sizes; the bytes are not kept). */
  attachments: { fileName: string; contentType: string; sizeBytes: number }[];
  receivedAt: Date;
};

export type SmtpSinkOptions = {
  port?: number;
  /** Loopback by default; the container deployment binds its private network. */
  host?: string;
  store: (m: SinkMessage) => Promise<void>;
  /** Largest message accepted, bytes (default 25 MiB). */
  maxBytes?: number;
};

export type SmtpSink = {
  port: number;
  host: string;
  close(): Promise<void>;
  /** false: refuse new mail with 421 (a temporary outage) while keeping the port open. */
  setAccepting(accepting: boolean): void;
};

const smtpError = (responseCode: number, message: string) => Object.assign(new Error(message), { responseCode });

/** Header name (lower case) → value, one line; repeated headers joined by newlines.
 * Address and text headers come decoded from the parser, the rest as sent (unfolded). */
export function headerRecord(mail: ParsedMail): Record<string, string> {
  const out: Record<string, string> = {};
  for (const { key, line } of mail.headerLines) {
    const value = line
      .slice(line.indexOf(':') + 1)
      .replace(/\r?\n[ \t]+/g, ' ')
      .trim();
    out[key] = out[key] === undefined ? value : `${out[key]}\n${value}`;
  }
  for (const [key, value] of mail.headers) {
    if (typeof value === 'string') out[key] = value;
    else if (value && typeof value === 'object' && 'text' in value && typeof value.text === 'string') out[key] = value.text;
  }
  return out;
}

export function toSinkMessage(mail: ParsedMail, session: SMTPServerSession, receivedAt = new Date()): SinkMessage {
  const envelope = session.envelope;
  return {
    messageId: mail.messageId ?? null,
    from: envelope.mailFrom ? envelope.mailFrom.address : '',
    to: envelope.rcptTo.map((r) => r.address),
    subject: mail.subject ?? '',
    text: mail.text ?? '',
    attachments: mail.attachments.map((a) => ({ fileName: a.filename ?? 'attachment', contentType: a.contentType, sizeBytes: a.size })),
    html: typeof mail.html === 'string' ? mail.html : null,
    headers: headerRecord(mail),
    receivedAt,
  };
}

/** A real SMTP server on loopback that nodemailer sends to; every message is parsed and handed to `store`. */
export async function startSmtpSink(opts: SmtpSinkOptions): Promise<SmtpSink> {
  const host = opts.host ?? '127.0.0.1';
  let accepting = true;
  const refusal = () => smtpError(421, 'Nestkeeper mail sink is not accepting mail just now; try again later');

  const server = new SMTPServer({
    name: 'nestkeeper-mail-sink',
    banner: 'Nestkeeper local mail sink',
    secure: false,
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    disableReverseLookup: true,
    size: opts.maxBytes ?? 25 * 1024 * 1024,
    closeTimeout: 1000,
    logger: false,
    onConnect(_session, callback) {
      callback(accepting ? undefined : refusal());
    },
    onMailFrom(_address, _session, callback) {
      // Also covers connections opened before the sink was switched off (pooled transports).
      callback(accepting ? undefined : refusal());
    },
    onData(stream: SMTPServerDataStream, session, callback) {
      simpleParser(stream)
        .then(async (mail) => {
          if (stream.sizeExceeded) return callback(); // smtp-server answers 552 itself
          await opts.store(toSinkMessage(mail, session));
          callback();
        })
        .catch((err: unknown) => {
          fakesLog.error({ err }, 'smtp sink could not keep a message');
          // Temporary failure, so the sender keeps the message and retries.
          callback(smtpError(451, 'Nestkeeper mail sink could not store the message; try again later'));
        });
    },
  });
  server.on('error', (err) => fakesLog.error({ err }, 'smtp sink server error'));

  const port = await listen(server.server, opts.port ?? 0, host);
  return {
    port,
    host,
    setAccepting(value) {
      accepting = value;
    },
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}

/** Keeps each message in `mail_sink_messages`; a re-delivered message (same Message-ID) is kept once. */
export function pgSinkStore(pool: Pool): (m: SinkMessage) => Promise<void> {
  return async (m) => {
    await pool.query(
      `INSERT INTO mail_sink_messages
         (message_id, envelope_from, recipients, subject, text_body, html_body, headers, attachments, received_at)
       VALUES ($1, $2, $3, $4, $5, $6, $7, $8, $9)
       ON CONFLICT (message_id) DO NOTHING`,
      [m.messageId, m.from, m.to, m.subject, m.text, m.html, JSON.stringify(m.headers), JSON.stringify(m.attachments), m.receivedAt],
    );
  };
}
