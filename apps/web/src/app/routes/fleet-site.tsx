import { useCallback, useMemo } from 'react';
import { useNavigate, useParams, useSearchParams } from 'react-router';
import { Button, ButtonLink } from '@/components/ui/button';
import { Checkbox } from '@/components/ui/checkbox';
import { EmptyState } from '@/components/ui/empty-state';
import { FormField, Select } from '@/components/ui/form-field';
import { Icon } from '@/components/ui/icon';
import { PageHeader } from '@/components/ui/page-header';
import { LoadingRegion, Skeleton } from '@/components/ui/skeleton';
import { paths, toSearch } from '@/config/paths';
import { LoadError } from '@/features/assets/components/load-error';
import { parseId } from '@/features/assets/lib/parse-id';
import { useEnergyAtRisk } from '@/features/fleet/api/get-energy-at-risk';
import { useFleetSites } from '@/features/fleet/api/get-fleet-sites';
import { useHealthMap } from '@/features/fleet/api/get-health-map';
import { FleetTabs } from '@/features/fleet/components/fleet-tabs';
import { HealthLegend } from '@/features/fleet/components/health-legend';
import { HealthList } from '@/features/fleet/components/health-list';
import { HealthMap } from '@/features/fleet/components/health-map';
import { fleetTabLinks } from '@/features/fleet/lib/fleet-links';
import { formatKWhPerDay, formatPower } from '@/features/fleet/lib/format';
import { layoutHealthGrid } from '@/features/fleet/lib/health-grid';
import { defaultMapParams, hasCellFilter, mapSearch, parseMapParams, type MapParams } from '@/features/fleet/lib/map-params';
import { cn } from '@/lib/cn';
import { NotFoundContent } from './not-found';

export function FleetSiteRoute() {
  const siteId = parseId(useParams().siteId);
  if (siteId === null) return <NotFoundContent />;
  return <FleetSitePage key={siteId} siteId={siteId} />;
}

function MapSkeleton() {
  return (
    <LoadingRegion label="Loading the string health map" className="flex flex-col gap-3">
      <div className="flex flex-wrap gap-2">
        {Array.from({ length: 5 }, (_, k) => (
          <Skeleton key={k} className="h-12 w-36" />
        ))}
      </div>
      <div className="rounded-card border border-line bg-surface p-3">
        {Array.from({ length: 8 }, (_, r) => (
          <div key={r} className="mb-1 flex gap-1">
            <Skeleton className="h-6 w-14" />
            {Array.from({ length: 20 }, (__, c) => (
              <Skeleton key={c} className="size-6 shrink-0 rounded-sm" />
            ))}
          </div>
        ))}
      </div>
    </LoadingRegion>
  );
}

/** One site's strings on a map coloured (and patterned) by their latest check, with the open tickets marked. */
function FleetSitePage({ siteId }: { siteId: number }) {
  const navigate = useNavigate();
  const [searchParams, setSearchParams] = useSearchParams();
  const params = parseMapParams(searchParams);
  const sites = useFleetSites();
  const map = useHealthMap(siteId);
  const energy = useEnergyAtRisk(siteId);

  const layout = useMemo(() => (map.data ? layoutHealthGrid(map.data.cells) : null), [map.data]);
  const hrefFor = useCallback((stringId: number) => paths.string(stringId), []);
  const onOpen = useCallback((stringId: number) => void navigate(paths.string(stringId)), [navigate]);

  const update = (changes: Partial<MapParams>) =>
    setSearchParams(toSearch(mapSearch({ ...params, ...changes })), { replace: true, preventScrollReset: true });

  const site = sites.data?.find((s) => s.id === siteId);
  const siteName = site ? site.name : `Site ${siteId}`;
  const tabs = fleetTabLinks({ siteId });
  const atRisk = energy.data?.items ?? [];
  const missingW = atRisk.reduce((sum, i) => sum + i.missingW, 0);
  const dailyKWh = atRisk.reduce((sum, i) => sum + i.dailyKWh, 0);
  const isFiltered = hasCellFilter(params) || params.inverter !== undefined;

  return (
    <>
      <PageHeader
        eyebrow={site ? <span className="readings font-mono">{site.code} · Fleet</span> : 'Fleet'}
        title={site ? `${site.name}: string health` : 'String health'}
        description="Every string by inverter and MPPT input, with its latest check. Select a string to open it."
        actions={
          sites.data && sites.data.length > 1 ? (
            <FormField label="Site" className="w-full sm:w-72">
              <Select value={String(siteId)} onChange={(e) => void navigate(paths.fleetSite(Number(e.target.value), mapSearch({ ...defaultMapParams, view: params.view })))}>
                {sites.data.map((s) => (
                  <option key={s.id} value={s.id}>
                    {s.code} · {s.name}
                  </option>
                ))}
              </Select>
            </FormField>
          ) : null
        }
      />
      <FleetTabs links={tabs} />

      {map.isPending ? (
        <MapSkeleton />
      ) : map.isError ? (
        <LoadError what="site" error={map.error} onRetry={() => void map.refetch()} isRetrying={map.isFetching} backTo={paths.fleet()} backLabel="Go to Fleet" />
      ) : !layout || layout.cellCount === 0 ? (
        <EmptyState
          icon="bolt"
          title="No strings registered at this site"
          description="The map fills in once the layout of the site has been imported."
          action={
            <ButtonLink to={paths.site(siteId)} variant="secondary">
              Open the site in Sites
            </ButtonLink>
          }
        />
      ) : (
        <>
          {atRisk.length > 0 ? (
            <p className="mb-4 flex flex-wrap items-center gap-x-3 gap-y-1 rounded-control border-2 border-attention/40 bg-attention-soft px-3 py-2 text-ink">
              <Icon name="bolt" className="size-5 text-attention" />
              <span>
                <strong>{atRisk.length === 1 ? '1 open ticket' : `${atRisk.length} open tickets`}</strong> here:{' '}
                <span className="readings">
                  about {formatPower(missingW)} missing, ≈ {formatKWhPerDay(dailyKWh)}
                </span>{' '}
                <span className="text-ink-muted">(estimate)</span>
              </span>
              <ButtonLink to={paths.fleetEnergy({ siteId })} variant="ghost" className="-my-1 underline">
                Energy at risk <Icon name="arrowRight" />
              </ButtonLink>
            </p>
          ) : null}

          <section aria-labelledby="legend-heading" className="mb-4">
            <h2 id="legend-heading" className="mb-2 text-lg font-semibold">
              Legend <span className="text-base font-normal text-ink-muted">· press one to show only those strings</span>
            </h2>
            <HealthLegend
              counts={map.data.counts}
              verdict={params.verdict}
              isOpenOnly={params.isOpenOnly}
              onVerdictChange={(verdict) => update({ verdict })}
              onOpenOnlyChange={(isOpenOnly) => update({ isOpenOnly })}
            />
          </section>

          <div className="mb-3 flex flex-wrap items-end gap-x-4 gap-y-2">
            <FormField label="Inverter" className="w-44">
              <Select value={params.inverter ?? ''} onChange={(e) => update({ inverter: e.target.value || undefined })}>
                <option value="">All inverters</option>
                {layout.rows.map((r) => (
                  <option key={r.inverterTag} value={r.inverterTag}>
                    {r.inverterTag}
                  </option>
                ))}
              </Select>
            </FormField>
            <Checkbox label="Open tickets only" checked={params.isOpenOnly} onChange={(e) => update({ isOpenOnly: e.target.checked })} />
            {isFiltered ? (
              <Button variant="ghost" onClick={() => update({ verdict: undefined, isOpenOnly: false, inverter: undefined })}>
                <Icon name="close" /> Clear filters
              </Button>
            ) : null}
            <div role="group" aria-label="Show as" className="ml-auto flex rounded-control border-2 border-edge bg-surface p-0.5">
              {(['map', 'list'] as const).map((view) => (
                <button
                  key={view}
                  type="button"
                  aria-pressed={params.view === view}
                  onClick={() => update({ view })}
                  className={cn('min-h-11 rounded-[0.375rem] px-4 font-semibold', params.view === view ? 'bg-brand text-on-brand' : 'text-ink hover:bg-sunken')}
                >
                  {view === 'map' ? 'Map' : 'List'}
                </button>
              ))}
            </div>
          </div>

          {params.view === 'map' ? (
            <HealthMap layout={layout} filters={params} hrefFor={hrefFor} onOpen={onOpen} siteName={siteName} />
          ) : (
            <HealthList key={`${params.verdict}-${params.isOpenOnly}-${params.inverter}`} layout={layout} filters={params} hrefFor={hrefFor} />
          )}
          <p className="mt-3 text-sm text-ink-muted">
            Colour, pattern and symbol say the same thing: solid is pass, stripes with ! need attention, hatching with ✕ failed, a hollow outline has no current check. A dark dot marks an
            open ticket. The list view gives the same strings worst first.
          </p>
        </>
      )}
    </>
  );
}
