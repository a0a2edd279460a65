import { can, type Role } from '@stringfield/shared';
import { Link } from 'react-router';
import { paths } from '@/config/paths';
import { cn } from '@/lib/cn';
import {
  defaultWorkOrderListParams,
  workOrderListSearch,
  type WorkOrderListParams,
} from '../lib/list-params';

type View = { label: string; params: Partial<WorkOrderListParams> };

function viewsFor(role: Role): View[] {
  if (role === 'owner') return [];
  const views: View[] = [{ label: 'Open', params: {} }];
  if (can(role, 'workOrders:dispatch')) views.push({ label: 'Unassigned', params: { assigneeId: 'none' } });
  if (role === 'technician') views.push({ label: 'Mine', params: { assigneeId: 'me' } });
  views.push({ label: 'Overdue', params: { isOverdueOnly: true } });
  views.push({ label: 'Awaiting sign-off', params: { status: ['awaiting_signoff'] } });
  views.push({ label: 'Returned', params: { status: ['returned'] } });
  views.push({ label: 'Everything', params: { status: [] } });
  return views;
}

/** Ready-made views of the board, as links: the same URLs a person can bookmark. */
export function BoardViews({ role, currentSearch }: { role: Role; currentSearch: string }) {
  const views = viewsFor(role);
  if (views.length === 0) return null;
  return (
    <nav aria-label="Ready-made views" className="mb-4 -mx-1 flex gap-2 overflow-x-auto px-1 pb-1">
      {views.map((view) => {
        const to = paths.workOrders(
          workOrderListSearch({ ...defaultWorkOrderListParams(role), ...view.params }, role),
        );
        const isCurrent = to === `${paths.workOrders()}${currentSearch}`;
        return (
          <Link
            key={view.label}
            to={to}
            aria-current={isCurrent ? 'page' : undefined}
            className={cn(
              'inline-flex min-h-touch shrink-0 items-center rounded-pill border-2 px-4 font-semibold whitespace-nowrap',
              isCurrent
                ? 'border-brand bg-brand text-on-brand'
                : 'border-edge bg-surface text-ink hover:bg-sunken',
            )}
          >
            {view.label}
          </Link>
        );
      })}
    </nav>
  );
}
