import { ButtonLink } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { Icon } from '@/components/ui/icon';
import { PageHeader } from '@/components/ui/page-header';
import { LoadingRegion, Skeleton } from '@/components/ui/skeleton';
import { paths } from '@/config/paths';
import { useEnergyAtRisk } from '@/features/fleet/api/get-energy-at-risk';
import { useFleetSites } from '@/features/fleet/api/get-fleet-sites';
import { FleetTabs } from '@/features/fleet/components/fleet-tabs';
import { energyBySite } from '@/features/fleet/lib/energy';
import { fleetTabLinks } from '@/features/fleet/lib/fleet-links';
import { formatKWhPerDay, formatNumber, formatPower } from '@/features/fleet/lib/format';
import { useSessionUser } from '../session';

/** The fleet at a glance: each visible site, how much its open tickets cost, and the way into its health map. */
export function FleetRoute() {
  const user = useSessionUser();
  const sites = useFleetSites();
  const energy = useEnergyAtRisk(undefined);
  const totals = energy.data ? energyBySite(energy.data.items) : null;

  return (
    <>
      <PageHeader
        eyebrow="Fleet"
        title={user.role === 'owner' ? 'Your sites' : 'Fleet'}
        description="Where the plants lose energy and how fast it is fixed. Open a site for the health of every string."
      />
      <FleetTabs links={fleetTabLinks({})} />

      {sites.isPending ? (
        <LoadingRegion label="Loading sites" className="grid gap-4 md:grid-cols-2 xl:grid-cols-3">
          {Array.from({ length: 3 }, (_, k) => (
            <Skeleton key={k} className="h-56 rounded-card" />
          ))}
        </LoadingRegion>
      ) : sites.isError ? (
        <ErrorState title="Sites did not load" error={sites.error} onRetry={() => void sites.refetch()} isRetrying={sites.isFetching} />
      ) : sites.data.length === 0 ? (
        <EmptyState
          icon="bolt"
          title={user.role === 'owner' ? 'No site is linked to your account yet' : 'No sites yet'}
          description={user.role === 'owner' ? 'Ask your O&M provider to add you as the owner of your sites.' : 'Add a site and import its layout in Sites.'}
        />
      ) : (
        <ul className="grid gap-4 md:grid-cols-2 xl:grid-cols-3">
          {sites.data.map((site) => {
            const t = totals?.get(site.code);
            return (
              <li key={site.id}>
                <Card className="flex h-full flex-col p-5">
                  <p className="readings font-mono text-sm font-semibold text-brand">{site.code}</p>
                  <h2 className="text-xl font-semibold">{site.name}</h2>
                  <p className="mt-1 text-ink-muted">
                    <span className="readings">{formatNumber(site.stringCount)}</span> strings on <span className="readings">{formatNumber(site.inverterCount)}</span>{' '}
                    {site.inverterCount === 1 ? 'inverter' : 'inverters'}
                  </p>
                  <dl className="mt-4 grid grid-cols-2 gap-3 rounded-control bg-sunken p-3">
                    <div>
                      <dt className="text-sm text-ink-muted">Open tickets</dt>
                      <dd className="readings text-xl font-bold">{energy.isPending ? '…' : formatNumber(t?.tickets ?? 0)}</dd>
                    </div>
                    <div>
                      <dt className="text-sm text-ink-muted">Missing now (est.)</dt>
                      <dd className="readings text-xl font-bold">{energy.isPending ? '…' : formatPower(t?.missingW ?? 0)}</dd>
                      {t ? <dd className="readings text-sm text-ink-muted">≈ {formatKWhPerDay(t.dailyKWh)}</dd> : null}
                    </div>
                  </dl>
                  {energy.isError ? <p className="mt-2 text-sm text-fail">Energy figures did not load.</p> : null}
                  <div className="mt-auto flex flex-wrap gap-2 pt-4">
                    <ButtonLink to={paths.fleetSite(site.id)} variant="brand">
                      Health map <Icon name="arrowRight" />
                    </ButtonLink>
                    <ButtonLink to={paths.fleetMetrics({ siteId: site.id })} variant="secondary">
                      Metrics<span className="sr-only"> of {site.code}</span>
                    </ButtonLink>
                    {t ? (
                      <ButtonLink to={paths.fleetEnergy({ siteId: site.id })} variant="secondary">
                        Energy<span className="sr-only"> at risk at {site.code}</span>
                      </ButtonLink>
                    ) : null}
                  </div>
                </Card>
              </li>
            );
          })}
        </ul>
      )}
    </>
  );
}
