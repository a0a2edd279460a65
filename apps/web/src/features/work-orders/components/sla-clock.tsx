import type { WorkOrderStatus } from '@stringfield/shared';
import { Icon } from '@/components/ui/icon';
import { cn } from '@/lib/cn';
import { useNow } from '../hooks/use-now';
import { formatSiteTime, slaCountdown, type SlaState } from '../lib/sla';

const stateClasses: Record<SlaState, string> = {
  overdue: 'text-fail',
  dueSoon: 'text-attention',
  onTrack: 'text-ink',
  stopped: 'text-ink-muted',
};

/**
 * The live repair deadline: "due in 3 h 12 min" / "overdue by 40 min", with the absolute time in the
 * site's zone. It is a timer (not a live region) so screen readers are not interrupted every tick;
 * its accessible name says it all in words when someone reaches it.
 */
export function SlaClock({
  dueAt,
  status,
  timeZone,
  size = 'md',
  showAbsolute = true,
  canWrap = false,
  isCompact = false,
  className,
}: {
  dueAt: string;
  status: WorkOrderStatus;
  timeZone: string;
  size?: 'md' | 'lg';
  showAbsolute?: boolean;
  /** Let the words wrap (narrow table columns); otherwise each line stays whole. */
  canWrap?: boolean;
  /** A table cell: a stopped clock's "was due" gets a line of its own, so the column stays narrow. */
  isCompact?: boolean;
  className?: string;
}) {
  const now = useNow();
  const countdown = slaCountdown(dueAt, status, now);
  const absolute = formatSiteTime(dueAt, timeZone);
  const label =
    countdown.state === 'stopped'
      ? `Deadline: ${countdown.spokenText}; it was ${absolute}, site time`
      : `Deadline: ${countdown.spokenText}, at ${absolute}, site time`;
  const isLate = countdown.state === 'overdue';
  return (
    <span role="timer" aria-label={label} className={cn('inline-flex flex-col', className)}>
      <span
        aria-hidden="true"
        className={cn(
          'readings inline-flex items-center gap-1.5 font-semibold',
          !canWrap && 'whitespace-nowrap',
          stateClasses[countdown.state],
          size === 'lg' && 'text-lg',
        )}
      >
        <Icon
          name={isLate ? 'alert' : countdown.state === 'stopped' ? 'check' : 'clock'}
          className={size === 'lg' ? 'size-6' : 'size-5'}
        />
        {countdown.text}
      </span>
      {showAbsolute ? (
        <time
          aria-hidden="true"
          dateTime={dueAt}
          className={cn('readings text-sm text-ink-muted', !canWrap && 'whitespace-nowrap')}
        >
          {countdown.state === 'stopped' ? <span className={cn(isCompact && 'block')}>was due </span> : null}
          {absolute}
        </time>
      ) : null}
    </span>
  );
}
