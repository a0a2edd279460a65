import type { MailSummary } from '@stringfield/shared';
import { Link } from 'react-router';
import { cn } from '@/lib/cn';
import { describeReceived } from './format';

/** The caught messages, newest first as the server sends them; the open one is marked. */
export function MailList({
  messages,
  selectedId,
  hrefFor,
}: {
  messages: MailSummary[];
  selectedId: string | undefined;
  hrefFor: (message: MailSummary) => string;
}) {
  return (
    <ul aria-label="Messages" className="flex flex-col gap-2">
      {messages.map((message) => {
        const received = describeReceived(message.receivedAt);
        const isSelected = message.id === selectedId;
        return (
          <li key={message.id}>
            <Link
              to={hrefFor(message)}
              aria-current={isSelected ? 'page' : undefined}
              className={cn(
                'block min-h-touch rounded-control border-2 px-4 py-3 transition-colors',
                isSelected ? 'border-brand bg-brand-soft' : 'border-line bg-surface hover:border-edge',
              )}
            >
              <span className="block font-semibold text-ink">{message.subject || '(no subject)'}</span>
              <span className="block truncate text-sm text-ink-muted">To {message.to.join(', ')}</span>
              <time dateTime={message.receivedAt} title={received.exact} className="readings block text-sm text-ink-faint">
                {received.relative}
              </time>
            </Link>
          </li>
        );
      })}
    </ul>
  );
}
