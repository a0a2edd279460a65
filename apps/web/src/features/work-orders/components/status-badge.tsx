import {
  priorityLabels,
  workOrderStatusLabels,
  type Priority,
  type WorkOrderStatus,
} from '@stringfield/shared';
import { Badge, type BadgeTone } from '@/components/ui/badge';
import type { IconName } from '@/components/ui/icon';

const statusLook: Record<WorkOrderStatus, { tone: BadgeTone; icon: IconName }> = {
  reported: { tone: 'neutral', icon: 'inbox' },
  dispatched: { tone: 'brand', icon: 'user' },
  in_field: { tone: 'brand', icon: 'bolt' },
  awaiting_signoff: { tone: 'attention', icon: 'clock' },
  returned: { tone: 'fail', icon: 'undo' },
  signed_off: { tone: 'pass', icon: 'check' },
  cancelled: { tone: 'neutral', icon: 'close' },
};

/**
 * The ticket's state in words, with an icon of its own so it reads without colour. Out of a table a
 * bare "In field" says little to a screen reader, so the badge names itself ("Status: In field");
 * `isInStatusColumn` leaves that off where a "Status" column header already says it.
 */
export function StatusBadge({ status, isInStatusColumn = false, className }: { status: WorkOrderStatus; isInStatusColumn?: boolean; className?: string }) {
  const look = statusLook[status];
  return (
    <Badge tone={look.tone} icon={look.icon} className={className}>
      {isInStatusColumn ? null : <span className="sr-only">Status: </span>}
      <span>{workOrderStatusLabels[status]}</span>
    </Badge>
  );
}

const priorityTone: Record<Priority, BadgeTone> = {
  P1: 'fail',
  P2: 'attention',
  P3: 'neutral',
  P4: 'neutral',
};

/** P1 … P4; the short form on the board, the long one (`P1 · urgent`) where there is room. */
export function PriorityBadge({
  priority,
  isLong = false,
  className,
}: {
  priority: Priority;
  isLong?: boolean;
  className?: string;
}) {
  return (
    <Badge tone={priorityTone[priority]} icon={priority === 'P1' ? 'alert' : null} className={className}>
      {isLong ? (
        priorityLabels[priority]
      ) : (
        <abbr title={priorityLabels[priority]} className="no-underline">
          {priority}
        </abbr>
      )}
    </Badge>
  );
}
