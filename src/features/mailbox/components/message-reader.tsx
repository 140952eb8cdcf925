import { useState } from 'react';
import { Button } from '../../../components/button';
import { ArrowLeftIcon } from '../../../components/icons';
import { formatFileSize, useFirmFormat } from '../../../lib/format';
import type { MailMessageView } from '../../../../shared/notifications/views';

const webAddress = /(https?:\/\/[^\s<>"]+)/;

/** The plain text with its web addresses as links (a mail's link is what its reader follows), everything else as text. */
function withLinks(text: string) {
  return text.split(webAddress).map((part, i) =>
    i % 2 ? (
      <a key={i} href={part} rel="noreferrer noopener" className="font-semibold text-ink-900 underline break-all">
        {part}
      </a>
    ) : (
      part
    ),
  );
}

/**
 * Shows one message. The plain-text body is the default; an HTML body is only
 * ever rendered inside an iframe with an empty sandbox (no scripts, no forms,
 * no same-origin access, no navigation).
 */
export function MessageReader({ message, onBack }: { message: MailMessageView; onBack?: () => void }) {
  const fmt = useFirmFormat();
  const hasText = Boolean(message.text?.trim());
  const hasHtml = Boolean(message.html?.trim());
  const [showHtml, setShowHtml] = useState(!hasText && hasHtml);

  return (
    <article aria-labelledby={`msg-${message.id}-subject`} className="flex min-w-0 flex-col gap-3">
      {onBack ? (
        <div className="sm:hidden">
          <Button size="sm" variant="quiet" icon={<ArrowLeftIcon size={14} />} onClick={onBack}>
            Back to messages
          </Button>
        </div>
      ) : null}
      <h2 id={`msg-${message.id}-subject`} className="text-xl font-bold break-words">
        {message.subject || '(no subject)'}
      </h2>
      <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-1 text-sm">
        <dt className="font-semibold text-ink-700">From</dt>
        <dd className="font-mono break-all">{message.from}</dd>
        <dt className="font-semibold text-ink-700">To</dt>
        <dd className="font-mono break-all">{message.to.join(', ')}</dd>
        <dt className="font-semibold text-ink-700">Received</dt>
        <dd>
          <time dateTime={message.receivedAt}>{fmt.dateTime(message.receivedAt)}</time>
        </dd>
        {message.attachments?.length ? (
          <>
            <dt className="font-semibold text-ink-700">Attached</dt>
            <dd>
              <ul className="flex flex-col">
                {message.attachments.map((a) => (
                  <li key={a.fileName} className="break-all">
                    <span className="font-mono">{a.fileName}</span> <span className="text-ink-500">· {formatFileSize(a.sizeBytes)}</span>
                  </li>
                ))}
              </ul>
            </dd>
          </>
        ) : null}
        {message.messageId ? (
          <>
            <dt className="font-semibold text-ink-700">Message id</dt>
            <dd className="font-mono text-xs break-all text-ink-700">{message.messageId}</dd>
          </>
        ) : null}
      </dl>
      {hasText && hasHtml ? (
        <div>
          <Button size="sm" onClick={() => setShowHtml((v) => !v)} aria-pressed={showHtml}>
            {showHtml ? 'Show plain text' : 'Show formatted version'}
          </Button>
        </div>
      ) : null}
      {showHtml && hasHtml ? (
        <iframe
          title={`Formatted version of “${message.subject || 'no subject'}”`}
          sandbox=""
          srcDoc={message.html ?? ''}
          referrerPolicy="no-referrer"
          className="h-[28rem] w-full rounded-md border border-paper-line bg-white"
        />
      ) : hasText ? (
        <pre className="overflow-x-auto rounded-md border border-paper-line bg-card p-3 text-sm whitespace-pre-wrap break-words">
          {withLinks(message.text ?? '')}
        </pre>
      ) : (
        <p className="text-ink-500">This message has no body.</p>
      )}
    </article>
  );
}
