import type { MailMessage } from '@stringfield/shared';
import { useState } from 'react';
import { Link } from 'react-router';
import { Icon } from '@/components/ui/icon';
import { cn } from '@/lib/cn';
import { extractLinks, toInAppPath } from '../lib/extract-links';
import { describeReceived } from './format';

type View = 'html' | 'text';

/**
 * One caught message. The HTML part renders in an iframe with an empty sandbox: no scripts, no forms,
 * no navigation of this page, its own opaque origin. Links are listed from the plain-text part.
 */
export function MailMessageView({ message }: { message: MailMessage }) {
  const [view, setView] = useState<View>(message.html ? 'html' : 'text');
  const received = describeReceived(message.receivedAt);
  const links = extractLinks(message.text);

  return (
    <article aria-labelledby="mail-subject" className="flex min-w-0 flex-col gap-4">
      <header className="rounded-card border border-line bg-surface p-4 shadow-card">
        <h2 id="mail-subject" className="text-xl font-bold break-words">
          {message.subject || '(no subject)'}
        </h2>
        <dl className="mt-3 grid grid-cols-[auto_minmax(0,1fr)] gap-x-4 gap-y-1 text-base">
          <dt className="text-ink-muted">From</dt>
          <dd className="break-all">{message.from}</dd>
          <dt className="text-ink-muted">To</dt>
          <dd className="break-all">{message.to.join(', ')}</dd>
          <dt className="text-ink-muted">Received</dt>
          <dd>
            <time dateTime={message.receivedAt} className="readings">
              {received.exact}
            </time>
          </dd>
        </dl>
      </header>

      {links.length > 0 ? (
        <section aria-labelledby="mail-links" className="rounded-card border-2 border-brand/30 bg-brand-soft p-4">
          <h3 id="mail-links" className="flex items-center gap-2 font-semibold">
            <Icon name="link" /> Links in this message
          </h3>
          <ul className="mt-2 flex flex-col gap-1">
            {links.map((link) => {
              const inApp = toInAppPath(link, window.location.origin);
              const className = 'inline-flex min-h-touch items-center font-medium break-all text-brand underline underline-offset-4 hover:text-brand-strong';
              return (
                <li key={link}>
                  {inApp ? (
                    <Link to={inApp} className={className}>
                      {link}
                    </Link>
                  ) : (
                    <a href={link} target="_blank" rel="noreferrer noopener" className={className}>
                      {link}
                      <span className="sr-only"> (opens in a new tab)</span>
                    </a>
                  )}
                </li>
              );
            })}
          </ul>
        </section>
      ) : null}

      <div className="flex gap-2" role="group" aria-label="Show the message as">
        {(['html', 'text'] as const).map((option) => (
          <button
            key={option}
            type="button"
            aria-pressed={view === option}
            disabled={option === 'html' && !message.html}
            onClick={() => setView(option)}
            className={cn(
              'min-h-touch rounded-control border-2 px-4 font-semibold disabled:cursor-not-allowed disabled:opacity-50',
              view === option ? 'border-brand bg-brand text-on-brand' : 'border-edge bg-surface text-ink hover:bg-sunken',
            )}
          >
            {option === 'html' ? 'Formatted' : 'Plain text'}
          </button>
        ))}
      </div>

      {view === 'html' && message.html ? (
        <iframe
          title={`Formatted message: ${message.subject}`}
          sandbox=""
          srcDoc={message.html}
          referrerPolicy="no-referrer"
          className="h-[65vh] min-h-96 w-full rounded-card border border-line bg-surface"
        />
      ) : (
        <pre className="overflow-x-auto rounded-card border border-line bg-surface p-4 font-mono text-sm whitespace-pre-wrap break-words">
          {message.text}
        </pre>
      )}
    </article>
  );
}
