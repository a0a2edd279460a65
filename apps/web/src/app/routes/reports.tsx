import type { Site } from '@stringfield/shared';
import { Link, useSearchParams } from 'react-router';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { Icon } from '@/components/ui/icon';
import { PageHeader } from '@/components/ui/page-header';
import { Pagination } from '@/components/ui/pagination';
import { LoadingRegion, Skeleton } from '@/components/ui/skeleton';
import { paths } from '@/config/paths';
import { useSites } from '@/features/assets/api/get-sites';
import { ReportList } from '@/features/sign-off/components/report-list';
import { useWorkOrders } from '@/features/work-orders/api/get-work-orders';
import { defaultWorkOrderListParams } from '@/features/work-orders/lib/list-params';
import { useSessionUser } from '../session';

/** On the overview a site shows its latest few; "all" pages through one site. */
const PREVIEW_SIZE = 5;
const PAGE_SIZE = 20;

function ListSkeleton() {
  return (
    <LoadingRegion label="Loading the reports" className="flex flex-col gap-3">
      <Skeleton className="h-28 rounded-card" />
      <Skeleton className="h-28 rounded-card" />
    </LoadingRegion>
  );
}

function SiteReports({ site, page, isSingle }: { site: Site; page: number; isSingle: boolean }) {
  const user = useSessionUser();
  const pageSize = isSingle ? PAGE_SIZE : PREVIEW_SIZE;
  const tickets = useWorkOrders({ ...defaultWorkOrderListParams(user.role), siteId: site.id, status: ['signed_off'], sort: '-reportedAt', page, pageSize });
  const [, setSearch] = useSearchParams();
  const titleId = `site-${site.id}-reports`;

  return (
    <section aria-labelledby={titleId} className="flex flex-col gap-3">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h2 id={titleId} className="text-xl font-semibold">
          {site.name} <span className="readings text-base font-normal text-ink-muted">{site.code}</span>
        </h2>
        {!isSingle && tickets.data && tickets.data.total > PREVIEW_SIZE ? (
          <Link to={paths.reports({ siteId: site.id })} className="inline-flex min-h-touch items-center gap-1 font-semibold text-brand underline underline-offset-4">
            All {tickets.data.total} reports <Icon name="arrowRight" className="size-4" />
          </Link>
        ) : null}
      </div>
      {tickets.isPending ? (
        <ListSkeleton />
      ) : tickets.isError ? (
        <ErrorState title={`The reports of ${site.code} did not load`} error={tickets.error} onRetry={() => void tickets.refetch()} isRetrying={tickets.isFetching} />
      ) : tickets.data.items.length === 0 ? (
        <EmptyState icon="file" headingLevel={3} title="No signed-off tickets yet" description="A close-out report appears here as soon as a supervisor signs a ticket of this site off." />
      ) : (
        <>
          <ReportList items={tickets.data.items} />
          {isSingle ? (
            <Pagination
              page={page}
              pageSize={pageSize}
              total={tickets.data.total}
              itemLabel="reports"
              onPageChange={(next) => setSearch(new URLSearchParams(paths.reports({ siteId: site.id, page: next }).split('?')[1] ?? ''))}
            />
          ) : null}
        </>
      )}
    </section>
  );
}

/** `/reports`: an asset owner's close-out reports, per site, newest first. */
export function ReportsRoute() {
  const [search] = useSearchParams();
  const siteId = Number(search.get('siteId')) || undefined;
  const page = Math.max(1, Number(search.get('page')) || 1);
  const sites = useSites({ q: '', sort: 'name', page: 1, pageSize: 100 });
  const shown = sites.data?.items.filter((s) => siteId === undefined || s.id === siteId) ?? [];

  return (
    <div className="mx-auto flex max-w-4xl flex-col gap-8">
      <div>
        {siteId ? (
          <Link to={paths.reports()} className="mb-2 inline-flex min-h-touch items-center gap-1 font-semibold text-brand underline-offset-4 hover:underline">
            <Icon name="chevronLeft" /> Every site
          </Link>
        ) : null}
        <PageHeader
          title="Close-out reports"
          description="Signed-off tickets of your sites, each with its PDF: the evidence, the checks, the diode records and the supervisor's sign-off with its digest."
          className="mb-0"
        />
      </div>
      {sites.isPending ? (
        <ListSkeleton />
      ) : sites.isError ? (
        <ErrorState title="Your sites did not load" error={sites.error} onRetry={() => void sites.refetch()} isRetrying={sites.isFetching} />
      ) : shown.length === 0 ? (
        <EmptyState
          icon="bolt"
          title={siteId ? 'That site is not one of yours' : 'No sites yet'}
          description={siteId ? 'Pick one of your sites from the list.' : 'Reports appear once a site of yours has signed-off tickets.'}
        />
      ) : (
        shown.map((site) => <SiteReports key={site.id} site={site} page={siteId ? page : 1} isSingle={siteId !== undefined} />)
      )}
    </div>
  );
}
