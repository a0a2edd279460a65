import {
  faultCategoryLabels,
  priorityLabels,
  workOrderStatusLabels,
  type FaultCategory,
  type Priority,
  type WorkOrderDetail,
  type WorkOrderEvent,
  type WorkOrderStatus,
} from '@stringfield/shared';
import { Icon, type IconName } from '@/components/ui/icon';
import { formatSiteTime } from '../lib/sla';

const fieldLabels: Record<string, string> = {
  assignee: 'Technician',
  dueAt: 'Due',
  title: 'Title',
  description: 'Description',
  priority: 'Priority',
  faultCategory: 'Fault category',
};

function formatValue(key: string, value: unknown, timeZone: string): string {
  if (value === null || value === undefined || value === '') return key === 'assignee' ? 'nobody' : '(empty)';
  if (key === 'dueAt' && typeof value === 'string') return formatSiteTime(value, timeZone);
  if (key === 'priority' && typeof value === 'string' && value in priorityLabels)
    return priorityLabels[value as Priority];
  if (key === 'faultCategory' && typeof value === 'string' && value in faultCategoryLabels)
    return faultCategoryLabels[value as FaultCategory];
  if (typeof value === 'string') return value.length > 120 ? `${value.slice(0, 117)}…` : value;
  return JSON.stringify(value);
}

const status = (s: WorkOrderStatus | null) => (s ? workOrderStatusLabels[s] : '');

function headline(event: WorkOrderEvent): { icon: IconName; text: string } {
  const who = event.actor?.name ?? 'Stringfield';
  switch (event.type) {
    case 'created':
      return { icon: 'plus', text: `${who} opened the ticket` };
    case 'assigned':
      return { icon: 'user', text: `${who} reassigned it` };
    case 'updated':
      return { icon: 'pencil', text: `${who} changed the ticket` };
    case 'comment':
      return { icon: 'chat', text: `${who} commented` };
    case 'transition':
      if (event.toStatus === 'returned')
        return { icon: 'undo', text: `${who} returned it to the technician` };
      if (event.toStatus === 'signed_off') return { icon: 'check', text: `${who} signed it off` };
      if (event.toStatus === 'cancelled') return { icon: 'close', text: `${who} cancelled it` };
      return {
        icon: 'arrowRight',
        text: `${who} moved it from ${status(event.fromStatus)} to ${status(event.toStatus)}`,
      };
  }
}

/** The ticket's history, oldest first: who did what when (in site time), what changed, and every comment. */
export function WorkOrderTimeline({ ticket }: { ticket: WorkOrderDetail }) {
  const tz = ticket.site.timeZone;
  return (
    <ol className="flex flex-col">
      {ticket.events.map((event, index) => {
        const { icon, text } = headline(event);
        const isLast = index === ticket.events.length - 1;
        const changes = Object.entries(event.changes ?? {});
        return (
          <li key={event.id} className="relative flex gap-3 pb-5 last:pb-0">
            {isLast ? null : (
              <span aria-hidden="true" className="absolute top-10 bottom-0 left-[1.1875rem] w-0.5 bg-line" />
            )}
            <span className="grid size-10 shrink-0 place-items-center rounded-full border-2 border-line bg-surface text-brand">
              <Icon name={icon} />
            </span>
            <div className="min-w-0 flex-1 pt-1.5">
              <p className="font-semibold">{text}</p>
              <p className="text-sm text-ink-muted">
                <time dateTime={event.createdAt} className="readings">
                  {formatSiteTime(event.createdAt, tz, { withWeekday: false, withYear: true })}
                </time>
              </p>
              {changes.length > 0 ? (
                <ul className="mt-1.5 flex flex-col gap-0.5 text-ink">
                  {changes.map(([key, change]) => (
                    <li key={key} className="[overflow-wrap:anywhere]">
                      <span className="text-ink-muted">{fieldLabels[key] ?? key}: </span>
                      {formatValue(key, change.from, tz)} <span aria-label="changed to">→</span>{' '}
                      <strong>{formatValue(key, change.to, tz)}</strong>
                    </li>
                  ))}
                </ul>
              ) : null}
              {event.comment ? (
                <blockquote className="mt-2 rounded-control border-l-4 border-edge bg-surface px-3 py-2 whitespace-pre-wrap [overflow-wrap:anywhere]">
                  {event.type !== 'comment' ? <span className="sr-only">Reason: </span> : null}
                  {event.comment}
                </blockquote>
              ) : null}
            </div>
          </li>
        );
      })}
    </ol>
  );
}
