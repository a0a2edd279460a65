import { useSearchParams } from 'react-router';
import { buttonClasses } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Icon } from '@/components/ui/icon';
import { PageHeader } from '@/components/ui/page-header';
import { toSearch } from '@/config/paths';
import { useFleetSites } from '@/features/fleet/api/get-fleet-sites';
import { FleetTabs } from '@/features/fleet/components/fleet-tabs';
import { PeriodPicker } from '@/features/fleet/components/period-picker';
import { SiteSelect } from '@/features/fleet/components/site-select';
import { exportHref, exportKinds } from '@/features/fleet/lib/exports';
import { fleetTabLinks } from '@/features/fleet/lib/fleet-links';
import { fleetFiltersSearch, parseFleetFilters, periodLabel, periodRange, type FleetFilters } from '@/features/fleet/lib/period';
import { useSessionUser } from '../session';

/** CSV downloads of one site's tickets, checks and diode replacements for a period: plain links, streamed by the API. */
export function FleetExportsRoute() {
  const user = useSessionUser();
  const [searchParams, setSearchParams] = useSearchParams();
  const filters = parseFleetFilters(searchParams);
  const sites = useFleetSites();
  // With one site there is nothing to choose.
  const siteId = filters.siteId ?? (sites.data?.length === 1 ? sites.data[0]?.id : undefined);
  const range = periodRange(filters.period);
  const site = sites.data?.find((s) => s.id === siteId);

  const update = (changes: Partial<FleetFilters>) =>
    setSearchParams(toSearch(fleetFiltersSearch({ ...filters, faultCategory: undefined, ...changes })), { replace: true, preventScrollReset: true });

  return (
    <>
      <PageHeader eyebrow="Fleet" title="Exports" description="Spreadsheet-ready CSV files of one site's work for a period, for reports and audits." />
      <FleetTabs links={fleetTabLinks({ ...filters, siteId })} />

      <Card className="mb-5 flex flex-col gap-4 p-4 lg:flex-row lg:items-start lg:justify-between">
        <PeriodPicker key={`${range.from}-${range.to}-${filters.period.preset}`} value={filters.period} onChange={(period) => update({ period })} />
        <SiteSelect className="sm:w-80" sites={sites.data ?? []} value={siteId} onChange={(id) => update({ siteId: id })} />
      </Card>

      <p className="mb-3 text-ink-muted">
        {site ? (
          <>
            <strong className="text-ink">{site.code}</strong>, {periodLabel(filters.period)} ({range.from} to {range.to}, UTC days).
          </>
        ) : (
          'Choose a site to download its files.'
        )}{' '}
        Files are UTF-8 with a byte-order mark, so spreadsheet programs read the units and names correctly.
        {user.role === 'owner' ? ' As an owner you get the signed-off work of your sites.' : ''}
      </p>

      <ul className="grid gap-4 md:grid-cols-3">
        {exportKinds.map((kind) => {
          const link = exportHref(kind.name, { siteId, from: range.from, to: range.to });
          return (
            <li key={kind.name}>
              <Card className="flex h-full flex-col p-5">
                <h2 className="flex items-center gap-2 text-lg font-semibold">
                  <Icon name="file" className="size-6 text-brand" />
                  {kind.title}
                </h2>
                <p className="mt-2 flex-1 text-sm text-ink-muted">{kind.contains}</p>
                {'href' in link ? (
                  <a href={link.href} download className={buttonClasses({ variant: 'brand', className: 'mt-4' })}>
                    Download {kind.title.toLowerCase()} CSV
                  </a>
                ) : (
                  <p className="mt-4 rounded-control bg-sunken px-3 py-3 text-sm font-semibold text-ink-muted">{link.error}</p>
                )}
              </Card>
            </li>
          );
        })}
      </ul>
    </>
  );
}
