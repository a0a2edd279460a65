import type { WorkOrderListItem } from '@stringfield/shared';
import { Link } from 'react-router';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { Icon } from '@/components/ui/icon';
import { LoadingRegion, Skeleton } from '@/components/ui/skeleton';
import { paths } from '@/config/paths';
import { cn } from '@/lib/cn';
import { useMyWorkOrders } from '../api/get-my-work-orders';
import { useNow } from '../hooks/use-now';
import { deviceTimeZone, groupMyWork } from '../lib/my-work';
import { SlaClock } from './sla-clock';
import { PriorityBadge, StatusBadge } from './status-badge';

function WorkCard({ item, isLate }: { item: WorkOrderListItem; isLate: boolean }) {
  const more = item.stringCount - item.stringLabels.length;
  return (
    <li>
      <Link
        to={paths.workOrder(item.id)}
        className={cn(
          'flex min-h-touch flex-col gap-2 rounded-card border-2 bg-surface p-4 shadow-card transition-colors hover:border-brand active:bg-sunken',
          isLate ? 'border-fail/60' : 'border-line',
        )}
      >
        <span className="flex flex-wrap items-center gap-2">
          <PriorityBadge priority={item.priority} />
          <StatusBadge status={item.status} />
          <span className="readings ml-auto text-sm text-ink-muted">{item.number}</span>
        </span>
        <span className="text-lg leading-snug font-semibold text-ink">{item.title}</span>
        <span className="flex flex-col text-ink-muted">
          <span>{item.site.name}</span>
          <span className="readings text-ink">
            {item.stringLabels.join(', ')}
            {more > 0 ? ` +${more} more` : ''}
          </span>
        </span>
        <span className="flex items-center justify-between gap-3 border-t border-line pt-2">
          <SlaClock dueAt={item.dueAt} status={item.status} timeZone={item.site.timeZone} />
          <Icon name="chevronRight" className="size-6 text-brand" />
        </span>
      </Link>
    </li>
  );
}

function Group({
  title,
  items,
  icon,
  isLate = false,
}: {
  title: string;
  items: WorkOrderListItem[];
  icon: 'alert' | 'today' | 'clock' | 'check';
  isLate?: boolean;
}) {
  if (items.length === 0) return null;
  return (
    <section aria-label={`${title}, ${items.length}`} className="flex flex-col gap-3">
      <h2 className={cn('flex items-center gap-2 text-lg font-bold', isLate ? 'text-fail' : 'text-ink')}>
        <Icon name={icon} className="size-6" />
        {title}
        <span className="readings rounded-pill bg-sunken px-2 text-base text-ink">{items.length}</span>
      </h2>
      <ul className="flex flex-col gap-3">
        {items.map((item) => (
          <WorkCard key={item.id} item={item} isLate={isLate} />
        ))}
      </ul>
    </section>
  );
}

/** A technician's open tickets as big tappable cards: overdue and due today first, each with its state and clock. */
export function MyWorkList() {
  const work = useMyWorkOrders();
  const now = useNow();

  if (work.isPending) {
    return (
      <LoadingRegion label="Loading your work orders" className="flex flex-col gap-3">
        {[0, 1, 2].map((i) => (
          <Skeleton key={i} className="h-40 rounded-card" />
        ))}
      </LoadingRegion>
    );
  }
  if (work.isError && !work.data) {
    return (
      <ErrorState
        title="Your work orders did not load"
        error={work.error}
        onRetry={() => void work.refetch()}
        isRetrying={work.isFetching}
      />
    );
  }
  if (work.data.items.length === 0) {
    return (
      <EmptyState
        icon="clipboard"
        title="Nothing assigned to you right now"
        description="When a dispatcher assigns you a faulty string, it appears here with the site, the string and the deadline."
      />
    );
  }
  const groups = groupMyWork(work.data.items, now, deviceTimeZone());
  return (
    <div className="flex flex-col gap-6">
      <Group title="Overdue" items={groups.overdue} icon="alert" isLate />
      <Group title="Due today" items={groups.dueToday} icon="today" />
      <Group title="Later" items={groups.later} icon="clock" />
      <Group title="Waiting for sign-off" items={groups.waiting} icon="check" />
    </div>
  );
}
