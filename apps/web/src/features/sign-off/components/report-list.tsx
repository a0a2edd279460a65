import { faultCategoryLabels, type WorkOrderListItem } from '@stringfield/shared';
import { Link } from 'react-router';
import { buttonClasses } from '@/components/ui/button';
import { Icon } from '@/components/ui/icon';
import { paths } from '@/config/paths';
import { reportFileName, reportUrl } from '../lib/report';

function formatDate(iso: string | null | undefined, timeZone: string, withTime = false): string {
  if (!iso) return '—';
  const date = new Date(iso);
  if (Number.isNaN(date.getTime())) return '—';
  return new Intl.DateTimeFormat('en-GB', {
    day: 'numeric',
    month: 'short',
    year: 'numeric',
    ...(withTime ? { hour: '2-digit', minute: '2-digit' } : {}),
    timeZone,
  }).format(date);
}

/** Signed-off tickets, one card each, with the close-out report to open or download. */
export function ReportList({ items }: { items: readonly WorkOrderListItem[] }) {
  return (
    <ul className="flex flex-col gap-3">
      {items.map((t) => (
        <li key={t.id} className="flex flex-col gap-3 rounded-card border border-line bg-surface p-4 shadow-card sm:flex-row sm:items-center sm:justify-between">
          {/* Grows to the card's width, so every card's two columns of facts start at the same place. */}
          <div className="min-w-0 sm:flex-1">
            <p className="readings text-sm font-semibold tracking-wide text-brand uppercase">{t.number}</p>
            <h3 className="text-lg font-semibold [overflow-wrap:anywhere]">
              <Link to={paths.workOrder(t.id)} className="underline-offset-4 hover:underline">
                {t.title}
              </Link>
            </h3>
            <dl className="mt-1 grid gap-x-4 gap-y-1 text-base sm:grid-cols-2">
              <div className="flex gap-1">
                <dt className="text-ink-muted">Reported</dt>
                <dd className="readings">{formatDate(t.reportedAt, t.site.timeZone)}</dd>
              </div>
              <div className="flex gap-1">
                <dt className="text-ink-muted">Signed off</dt>
                <dd className="readings">{formatDate(t.signedOffAt, t.site.timeZone, true)}</dd>
              </div>
              <div className="flex gap-1">
                <dt className="text-ink-muted">{t.stringLabels.length === 1 ? 'String' : 'Strings'}</dt>
                <dd className="readings min-w-0">
                  {/* Lines break between labels, not inside one at its hyphens. */}
                  {t.stringLabels.length === 0
                    ? '—'
                    : t.stringLabels.map((label, i) => (
                        <span key={label}>
                          {i > 0 ? ', ' : null}
                          <span className="whitespace-nowrap">{label}</span>
                        </span>
                      ))}
                </dd>
              </div>
              <div className="flex gap-1">
                <dt className="text-ink-muted">Fault</dt>
                <dd>{faultCategoryLabels[t.faultCategory]}</dd>
              </div>
            </dl>
          </div>
          <div className="flex shrink-0 flex-col gap-2 sm:items-end">
            <a href={reportUrl(t.id)} download={reportFileName(t.number)} className={buttonClasses({ variant: 'primary' })}>
              <Icon name="file" /> Download PDF<span className="sr-only"> of {t.number}</span>
            </a>
            <a href={reportUrl(t.id)} target="_blank" rel="noreferrer" className="inline-flex min-h-touch items-center font-semibold text-brand underline underline-offset-4">
              Open<span className="sr-only"> the report of {t.number} in a new tab</span>
            </a>
          </div>
        </li>
      ))}
    </ul>
  );
}
