import { can } from '@stringfield/shared';
import type { SortingState, Updater } from '@tanstack/react-table';
import { useState } from 'react';
import { useNavigate, useSearchParams } from 'react-router';
import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { Icon } from '@/components/ui/icon';
import { PageHeader } from '@/components/ui/page-header';
import { Pagination } from '@/components/ui/pagination';
import { paths, toSearch } from '@/config/paths';
import { useSites } from '@/features/assets/api/get-sites';
import { CreateSiteDialog } from '@/features/assets/components/create-site-dialog';
import { SitesFilters } from '@/features/assets/components/sites-filters';
import { SitesTable } from '@/features/assets/components/sites-table';
import {
  defaultSitesListParams,
  parseSitesListParams,
  siteSorts,
  sitesListSearch,
  sortingFromParam,
  sortParamFromSorting,
  type SitesListParams,
} from '@/features/assets/lib/list-params';
import { useSessionUser } from '../session';

/** Sites: every plant the person may see, with string counts and sizing failures; state in the URL. */
export function SitesRoute() {
  const user = useSessionUser();
  const canWrite = can(user.role, 'assets:write');
  const navigate = useNavigate();
  const [searchParams, setSearchParams] = useSearchParams();
  const params = parseSitesListParams(searchParams);
  const sites = useSites(params);
  const [isCreating, setIsCreating] = useState(false);

  const update = (changes: Partial<SitesListParams>, options: { replace?: boolean } = {}) => {
    const next = { ...params, page: 1, ...changes };
    setSearchParams(toSearch(sitesListSearch(next)), { replace: options.replace ?? false, preventScrollReset: true });
  };

  const sorting = sortingFromParam(params.sort);
  const onSortingChange = (updater: Updater<SortingState>) => {
    const nextSorting = typeof updater === 'function' ? updater(sorting) : updater;
    update({ sort: sortParamFromSorting(nextSorting, siteSorts, defaultSitesListParams.sort) });
  };

  const data = sites.data;
  const newSiteButton = canWrite ? (
    <Button variant="primary" onClick={() => setIsCreating(true)}>
      <Icon name="plus" /> New site
    </Button>
  ) : null;

  return (
    <>
      <PageHeader
        title="Sites"
        description={canWrite ? 'Plants in the registry: open one to see its inverters, strings and sizing checks.' : 'The plants you can see, with their strings and sizing checks.'}
        actions={newSiteButton}
      />

      <SitesFilters value={params} onChange={(changes) => update(changes, { replace: 'q' in changes })} />

      {sites.isError && !data ? (
        <ErrorState title="Sites did not load" error={sites.error} onRetry={() => void sites.refetch()} isRetrying={sites.isFetching} />
      ) : (
        <>
          <SitesTable
            sites={data?.items ?? []}
            sorting={sorting}
            onSortingChange={onSortingChange}
            isLoading={sites.isPending}
            isFetching={sites.isPlaceholderData}
            emptyState={
              params.q ? (
                <EmptyState
                  icon="search"
                  title={`No site matches “${params.q}”`}
                  description="Search by site name or code, like OSR."
                  action={
                    <Button variant="secondary" onClick={() => update({ q: '' })}>
                      Clear search
                    </Button>
                  }
                />
              ) : (
                <EmptyState
                  icon="bolt"
                  title="No sites yet"
                  description={canWrite ? 'Register a plant, then import its string layout from a CSV.' : 'No plant has been shared with you yet. Ask your dispatcher.'}
                  action={newSiteButton}
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
              itemLabel={data.total === 1 ? 'site' : 'sites'}
              onPageChange={(page) => update({ page })}
            />
          ) : null}
        </>
      )}

      {canWrite ? (
        <CreateSiteDialog
          isOpen={isCreating}
          onClose={() => setIsCreating(false)}
          onCreated={(site) => {
            setIsCreating(false);
            void navigate(paths.site(site.id));
          }}
        />
      ) : null}
    </>
  );
}
