import { can } from '@stringfield/shared';
import type { SortingState, Updater } from '@tanstack/react-table';
import { useParams, useSearchParams } from 'react-router';
import { Button, ButtonLink } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { Icon } from '@/components/ui/icon';
import { PageHeader } from '@/components/ui/page-header';
import { Pagination } from '@/components/ui/pagination';
import { LoadingRegion, Skeleton } from '@/components/ui/skeleton';
import { LoadError } from '@/features/assets/components/load-error';
import { paths, toSearch } from '@/config/paths';
import { useInverters } from '@/features/assets/api/get-inverters';
import { useSite } from '@/features/assets/api/get-site';
import { useSiteStrings } from '@/features/assets/api/get-site-strings';
import { InverterList } from '@/features/assets/components/inverter-list';
import { SiteFacts } from '@/features/assets/components/site-facts';
import { SizingSummary } from '@/features/assets/components/sizing-summary';
import { StringsFilters } from '@/features/assets/components/strings-filters';
import { StringsTable } from '@/features/assets/components/strings-table';
import {
  defaultStringsListParams,
  parseStringsListParams,
  sortingFromParam,
  sortParamFromSorting,
  stringSorts,
  stringsListSearch,
  type StringsListParams,
} from '@/features/assets/lib/list-params';
import { parseId } from '@/features/assets/lib/parse-id';
import { useSessionUser } from '../session';
import { NotFoundContent } from './not-found';

export function SiteRoute() {
  const siteId = parseId(useParams().siteId);
  if (siteId === null) return <NotFoundContent />;
  return <SitePage key={siteId} siteId={siteId} />;
}

/** One plant: its design conditions, the sizing summary and every string, inverter by inverter. */
function SitePage({ siteId }: { siteId: number }) {
  const user = useSessionUser();
  const canWrite = can(user.role, 'assets:write');
  const site = useSite(siteId);
  const inverters = useInverters(siteId);
  const [searchParams, setSearchParams] = useSearchParams();
  const params = parseStringsListParams(searchParams);
  const strings = useSiteStrings(siteId, params);

  const searchFor = (changes: Partial<StringsListParams>) => toSearch(stringsListSearch({ ...params, page: 1, ...changes }));
  const update = (changes: Partial<StringsListParams>, options: { replace?: boolean } = {}) =>
    setSearchParams(searchFor(changes), { replace: options.replace ?? false, preventScrollReset: true });

  const sorting = sortingFromParam(params.sort);
  const onSortingChange = (updater: Updater<SortingState>) => {
    const next = typeof updater === 'function' ? updater(sorting) : updater;
    update({ sort: sortParamFromSorting(next, stringSorts, defaultStringsListParams.sort) });
  };

  if (site.isPending)
    return (
      <LoadingRegion label="Loading the site" className="flex flex-col gap-4">
        <Skeleton className="h-5 w-24" />
        <Skeleton className="h-9 w-2/3" />
        <div className="grid grid-cols-2 gap-3 lg:grid-cols-6">
          {Array.from({ length: 6 }, (_, k) => (
            <Skeleton key={k} className="h-16 rounded-card" />
          ))}
        </div>
        <Skeleton className="h-64 rounded-card" />
      </LoadingRegion>
    );
  if (site.isError)
    return <LoadError what="site" error={site.error} onRetry={() => void site.refetch()} isRetrying={site.isFetching} backTo={paths.sites()} backLabel="Go to Sites" />;

  const s = site.data;
  const data = strings.data;
  const hasFilters = params.q !== '' || params.inverterId !== undefined || params.mpptInput !== undefined || params.sizing !== 'all';
  const inverterList = inverters.data ?? [];
  const selected = inverterList.find((i) => i.id === params.inverterId);

  return (
    <>
      <PageHeader
        eyebrow={<span className="readings font-mono">{s.code}</span>}
        title={s.name}
        description={s.address || undefined}
        actions={
          <>
            <ButtonLink to={paths.siteLabels(s.id, { inverterId: params.inverterId })} variant="secondary">
              <Icon name="file" /> Print QR labels
            </ButtonLink>
            {canWrite ? (
              <ButtonLink to={paths.siteImport(s.id)} variant="primary">
                <Icon name="plus" /> Import layout
              </ButtonLink>
            ) : null}
          </>
        }
      />

      <section aria-label="Design conditions" className="mb-6">
        <SiteFacts site={s} />
      </section>

      <section aria-labelledby="sizing-heading" className="mb-8">
        <h2 id="sizing-heading" className="mb-3 text-xl font-semibold">
          String sizing
        </h2>
        <SizingSummary siteId={s.id} stringCount={s.stringCount} failingHref={paths.site(s.id, stringsListSearch({ ...defaultStringsListParams, sizing: 'fail' }))} />
      </section>

      <section aria-labelledby="inverters-heading" className="mb-8">
        <h2 id="inverters-heading" className="mb-3 text-xl font-semibold">
          Inverters
        </h2>
        {inverters.isPending ? (
          <LoadingRegion label="Loading inverters" className="grid grid-cols-2 gap-2 sm:grid-cols-5">
            {Array.from({ length: 5 }, (_, k) => (
              <Skeleton key={k} className="h-16" />
            ))}
          </LoadingRegion>
        ) : inverters.isError ? (
          <ErrorState title="Inverters did not load" error={inverters.error} onRetry={() => void inverters.refetch()} isRetrying={inverters.isFetching} />
        ) : (
          <InverterList
            inverters={inverterList}
            selectedId={params.inverterId}
            hrefFor={(inverterId) => `${paths.site(s.id)}${searchFor({ inverterId, mpptInput: undefined })}`}
          />
        )}
      </section>

      <section aria-labelledby="strings-heading">
        <h2 id="strings-heading" className="mb-3 text-xl font-semibold">
          Strings{selected ? ` of ${selected.tag}` : ''}
        </h2>
        <StringsFilters value={params} inverters={inverterList} onChange={(changes) => update(changes, { replace: 'q' in changes && Object.keys(changes).length === 1 })} />
        {strings.isError && !data ? (
          <ErrorState title="Strings did not load" error={strings.error} onRetry={() => void strings.refetch()} isRetrying={strings.isFetching} />
        ) : (
          <>
            <div aria-live="polite" className="sr-only">
              {data ? `${data.total} ${data.total === 1 ? 'string' : 'strings'} found` : ''}
            </div>
            <StringsTable
              caption={`Strings of ${s.code}${selected ? `, ${selected.tag}` : ''}${params.sizing === 'fail' ? ', failing a sizing check' : ''}`}
              strings={data?.items ?? []}
              sorting={sorting}
              onSortingChange={onSortingChange}
              isLoading={strings.isPending}
              isFetching={strings.isPlaceholderData}
              emptyState={
                hasFilters ? (
                  <EmptyState
                    icon="search"
                    title="No string matches these filters"
                    description={params.sizing === 'fail' ? 'Good news if you were looking for failures.' : 'Try a shorter label, or another inverter or input.'}
                    action={
                      <Button variant="secondary" onClick={() => update({ q: '', inverterId: undefined, mpptInput: undefined, sizing: 'all' })}>
                        Clear filters
                      </Button>
                    }
                  />
                ) : (
                  <EmptyState
                    icon="bolt"
                    title="No strings registered yet"
                    description={canWrite ? 'Import the layout CSV to add every string at once.' : 'The dispatcher has not imported the layout of this site yet.'}
                    action={
                      canWrite ? (
                        <ButtonLink to={paths.siteImport(s.id)} variant="primary">
                          Import layout
                        </ButtonLink>
                      ) : null
                    }
                  />
                )
              }
            />
            {data && data.total > 0 ? (
              <Pagination
                className="mt-5"
                page={data.page}
                pageSize={data.pageSize}
                total={data.total}
                itemLabel={data.total === 1 ? 'string' : 'strings'}
                onPageChange={(page) => update({ page })}
              />
            ) : null}
          </>
        )}
      </section>
    </>
  );
}
