import { can } from '@stringfield/shared';
import { useQueryClient } from '@tanstack/react-query';
import type { SortingState, Updater } from '@tanstack/react-table';
import { useSearchParams } from 'react-router';
import { Badge } from '@/components/ui/badge';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { PageHeader } from '@/components/ui/page-header';
import { LoadingRegion, Skeleton } from '@/components/ui/skeleton';
import { paths, toSearch } from '@/config/paths';
import { assetKeys } from '@/features/assets/api/keys';
import { useEnergyAtRisk } from '@/features/fleet/api/get-energy-at-risk';
import { useFleetSites } from '@/features/fleet/api/get-fleet-sites';
import { EnergyTable } from '@/features/fleet/components/energy-table';
import { FleetTabs } from '@/features/fleet/components/fleet-tabs';
import { PeakSunHours } from '@/features/fleet/components/peak-sun-hours';
import { SiteSelect } from '@/features/fleet/components/site-select';
import { parseEnergySort, sortEnergyItems, type EnergySort } from '@/features/fleet/lib/energy';
import { fleetTabLinks } from '@/features/fleet/lib/fleet-links';
import { formatKWhPerDay, formatPower } from '@/features/fleet/lib/format';
import { parseFleetFilters } from '@/features/fleet/lib/period';
import { useSessionUser } from '../session';

/** Open tickets ranked by the power their strings are missing, with a daily kWh estimate per site's peak sun hours. */
export function FleetEnergyRoute() {
  const user = useSessionUser();
  const queryClient = useQueryClient();
  const [searchParams, setSearchParams] = useSearchParams();
  const { siteId } = parseFleetFilters(searchParams);
  const sort = parseEnergySort(searchParams.get('sort'));
  const sites = useFleetSites();
  const energy = useEnergyAtRisk(siteId);
  const canEditSites = can(user.role, 'assets:write');
  // Owners see only signed-off tickets; an open ticket's page is not theirs to open.
  const canOpenTickets = user.role !== 'owner' && can(user.role, 'workOrders:read');

  const setSearch = (changes: { siteId?: number | undefined; sort?: EnergySort }) => {
    const next = { siteId, sort, ...changes };
    setSearchParams(toSearch({ siteId: next.siteId, sort: next.sort === 'missingW' ? undefined : next.sort }), { replace: true, preventScrollReset: true });
  };

  const sorting: SortingState = [{ id: sort, desc: sort !== 'number' }];
  const onSortingChange = (updater: Updater<SortingState>) => {
    const next = typeof updater === 'function' ? updater(sorting) : updater;
    setSearch({ sort: parseEnergySort(next[0]?.id ?? null) });
  };

  const items = energy.data ? sortEnergyItems(energy.data.items, sort) : [];
  const missingW = items.reduce((s, i) => s + i.missingW, 0);
  const dailyKWh = items.reduce((s, i) => s + i.dailyKWh, 0);
  const scopeSites = (sites.data ?? []).filter((s) => siteId === undefined || s.id === siteId);
  const site = sites.data?.find((s) => s.id === siteId);

  return (
    <>
      <PageHeader
        eyebrow="Fleet"
        title="Energy at risk"
        description="What the open tickets cost while they stay open: the power their strings are missing now, and roughly how much energy that is a day."
      />
      <FleetTabs links={fleetTabLinks({ siteId })} />

      <div className="mb-5 flex flex-col gap-4 lg:flex-row lg:items-end">
        <SiteSelect className="w-full sm:w-80" sites={sites.data ?? []} value={siteId} allLabel="Every site" onChange={(id) => setSearch({ siteId: id })} />
      </div>

      <section aria-label="How this is estimated" className="mb-5 rounded-card border-2 border-attention/40 bg-attention-soft p-4">
        <p className="flex flex-wrap items-center gap-2">
          <Badge tone="attention">Estimate</Badge>
          <span className="font-semibold">Not a metered loss.</span>
        </p>
        <p className="mt-2 max-w-prose text-ink">{energy.data?.note ?? 'Estimate: expected Pmp at the design irradiance minus what the latest check implies, times the site’s assumed peak sun hours.'}</p>
        <div className="mt-3 flex flex-col gap-2">
          <p className="text-sm font-semibold text-ink-muted">Assumed peak sun hours{canEditSites ? ' (change if your site records differ)' : ''}</p>
          {sites.isPending ? (
            <Skeleton className="h-6 w-48" />
          ) : (
            <ul className="flex flex-col gap-2">
              {scopeSites.map((s) => (
                <li key={s.id}>
                  <PeakSunHours site={s} canEdit={canEditSites} onSaved={() => void queryClient.invalidateQueries({ queryKey: assetKeys.sites() })} />
                </li>
              ))}
            </ul>
          )}
        </div>
      </section>

      {energy.isError ? (
        <ErrorState title="Energy at risk did not load" error={energy.error} onRetry={() => void energy.refetch()} isRetrying={energy.isFetching} />
      ) : (
        <>
          {energy.isPending ? (
            <LoadingRegion label="Loading totals" className="mb-4">
              <Skeleton className="h-8 w-72" />
            </LoadingRegion>
          ) : items.length > 0 ? (
            <p className="mb-4 text-lg" aria-live="polite">
              <strong>{items.length === 1 ? '1 open ticket' : `${items.length} open tickets`}</strong>
              {site ? ` at ${site.code}` : ''}:{' '}
              <span className="readings font-semibold">{formatPower(missingW)}</span> missing,{' '}
              <span className="readings font-semibold">≈ {formatKWhPerDay(dailyKWh)}</span> <span className="text-ink-muted">(estimate)</span>
            </p>
          ) : null}
          <EnergyTable
            items={items}
            sorting={sorting}
            onSortingChange={onSortingChange}
            ticketHref={canOpenTickets ? (id) => paths.workOrder(id) : null}
            isLoading={energy.isPending}
            caption={`Open tickets by missing power${site ? ` at ${site.code}` : ''}, estimate`}
            emptyState={
              <EmptyState
                icon="check"
                title="No open ticket is costing energy"
                description={site ? `Nothing is open at ${site.code} right now.` : 'Every ticket on the sites you can see is closed.'}
              />
            }
          />
        </>
      )}
    </>
  );
}
