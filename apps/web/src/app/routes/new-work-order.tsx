import { useNavigate, useSearchParams } from 'react-router';
import { toast } from '@/lib/toast';
import { ButtonLink } from '@/components/ui/button';
import { Icon } from '@/components/ui/icon';
import { PageHeader } from '@/components/ui/page-header';
import { paths } from '@/config/paths';
import { CreateWorkOrderForm } from '@/features/work-orders/components/create-work-order-form';
import { defaultWorkOrderListParams, workOrderListSearch } from '@/features/work-orders/lib/list-params';
import { useSessionUser } from '../session';

/** `/work-orders/new[?siteId=]`: open one ticket, or one per string. */
export function NewWorkOrderRoute() {
  const user = useSessionUser();
  const navigate = useNavigate();
  const [searchParams] = useSearchParams();
  const siteParam = Number(searchParams.get('siteId'));
  const initialSiteId = Number.isInteger(siteParam) && siteParam > 0 ? siteParam : undefined;

  return (
    <div className="mx-auto max-w-5xl">
      <nav aria-label="Breadcrumb" className="mb-2">
        <ButtonLink to={paths.workOrders()} variant="ghost" className="-ml-4 text-brand">
          <Icon name="chevronLeft" /> Work orders
        </ButtonLink>
      </nav>
      <PageHeader
        title="New work order"
        description="Report a DC string fault so it can be dispatched, repaired and signed off."
      />
      <CreateWorkOrderForm
        initialSiteId={initialSiteId}
        onCreated={(items) => {
          const [first] = items;
          const last = items[items.length - 1];
          if (!first || !last) return;
          if (items.length === 1) {
            toast.success(`${first.number} opened`, {
              description: first.assignee
                ? `Dispatched to ${first.assignee.name}.`
                : 'Dispatch it when you know who goes.',
            });
            void navigate(paths.workOrder(first.id));
            return;
          }
          toast.success(`${items.length} tickets opened`, {
            description: `${first.number} to ${last.number}`,
          });
          // The new tickets share site and title; the board shows them newest first.
          const view = {
            ...defaultWorkOrderListParams(user.role),
            siteId: first.site.id,
            q: first.title.slice(0, 100),
            sort: '-number' as const,
          };
          void navigate(paths.workOrders(workOrderListSearch(view, user.role)));
        }}
      />
    </div>
  );
}
