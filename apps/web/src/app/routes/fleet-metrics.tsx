import { faultCategories, faultCategoryLabels, type MetricsQuery } from '@stringfield/shared';
import { lazy, type ReactNode } from 'react';
import { Link, useSearchParams } from 'react-router';
import { Card } from '@/components/ui/card';
import { ErrorState } from '@/components/ui/error-state';
import { FormField, Select } from '@/components/ui/form-field';
import { Icon, type IconName } from '@/components/ui/icon';
import { PageHeader } from '@/components/ui/page-header';
import { LoadingRegion, Skeleton } from '@/components/ui/skeleton';
import { paths, toSearch } from '@/config/paths';
import { useFleetSites } from '@/features/fleet/api/get-fleet-sites';
import { useMetrics } from '@/features/fleet/api/get-metrics';
import { ChartPanel, FigureTable } from '@/features/fleet/components/chart-panel';
import { FleetTabs } from '@/features/fleet/components/fleet-tabs';
import { PeriodPicker } from '@/features/fleet/components/period-picker';
import { SiteSelect } from '@/features/fleet/components/site-select';
import { fleetTabLinks } from '@/features/fleet/lib/fleet-links';
import { formatDuration, formatNumber, formatRate } from '@/features/fleet/lib/format';
import { meanTimeRows, openByStatusRows, topCategoryRows, totalOpen } from '@/features/fleet/lib/metrics-data';
import { fleetFiltersSearch, parseFleetFilters, periodLabel, periodRange, type FleetFilters } from '@/features/fleet/lib/period';
import { cn } from '@/lib/cn';
import { useSessionUser } from '../session';

// recharts only loads when a chart is on screen, never with a technician's pages.
const OpenByStatusChart = lazy(() => import('@/features/fleet/components/metrics-charts').then((m) => ({ default: m.OpenByStatusChart })));
const MeanTimesChart = lazy(() => import('@/features/fleet/components/metrics-charts').then((m) => ({ default: m.MeanTimesChart })));
const CountBarChart = lazy(() => import('@/features/fleet/components/metrics-charts').then((m) => ({ default: m.CountBarChart })));

function StatCard({ icon, label, value, detail, tone = 'neutral' }: { icon: IconName; label: string; value: string; detail: ReactNode; tone?: 'neutral' | 'fail' | 'pass' }) {
  return (
    <Card className={cn('p-3 sm:p-4', tone === 'fail' && 'border-2 border-fail/40 bg-fail-soft', tone === 'pass' && 'border-2 border-pass/30')}>
      <p className="flex items-center gap-2 text-sm font-semibold text-ink-muted">
        <Icon name={icon} className={cn('size-5', tone === 'fail' ? 'text-fail' : tone === 'pass' ? 'text-pass' : 'text-brand')} />
        {label}
      </p>
      <p className="readings mt-1 text-3xl font-bold text-ink">{value}</p>
      <p className="mt-1 text-sm text-ink-muted">{detail}</p>
    </Card>
  );
}

/** How fast the crew works: overdue and first-time-fix figures, then charts, each with its table. */
export function FleetMetricsRoute() {
  const user = useSessionUser();
  const [searchParams, setSearchParams] = useSearchParams();
  const filters = parseFleetFilters(searchParams);
  const range = periodRange(filters.period);
  const query: MetricsQuery = { from: range.from, to: range.to, siteId: filters.siteId, faultCategory: filters.faultCategory };
  const sites = useFleetSites();
  const metrics = useMetrics(query);

  const update = (changes: Partial<FleetFilters>) =>
    setSearchParams(toSearch(fleetFiltersSearch({ ...filters, ...changes })), { replace: false, preventScrollReset: true });

  const m = metrics.data;
  const isOwner = user.role === 'owner';
  const open = m ? openByStatusRows(m) : [];
  const means = m ? meanTimeRows(m) : [];
  const top = m ? topCategoryRows(m) : [];
  const repeats = m ? m.repeatFaults.map((r) => ({ label: `${r.siteCode} ${r.label}`, count: r.repeats, stringId: r.stringId })) : [];
  const periodText = periodLabel(filters.period);

  return (
    <>
      <PageHeader eyebrow="Fleet" title="Metrics" description="How quickly faults are dispatched, repaired and signed off, and which keep coming back." />
      <FleetTabs links={fleetTabLinks(filters)} />

      <Card className="mb-5 flex flex-col gap-4 p-4 lg:flex-row lg:items-start lg:justify-between">
        <PeriodPicker key={`${range.from}-${range.to}-${filters.period.preset}`} value={filters.period} onChange={(period) => update({ period })} />
        <div className="flex flex-col gap-3 sm:flex-row lg:flex-col">
          <SiteSelect className="sm:w-72" sites={sites.data ?? []} value={filters.siteId} allLabel="Every site" onChange={(siteId) => update({ siteId })} />
          <FormField label="Fault category" className="sm:w-72">
            <Select value={filters.faultCategory ?? ''} onChange={(e) => update({ faultCategory: (e.target.value || undefined) as FleetFilters['faultCategory'] })}>
              <option value="">Every category</option>
              {faultCategories.map((c) => (
                <option key={c} value={c}>
                  {faultCategoryLabels[c]}
                </option>
              ))}
            </Select>
          </FormField>
        </div>
      </Card>

      {isOwner ? (
        <p className="mb-4 flex items-start gap-2 text-ink-muted">
          <Icon name="info" className="mt-0.5 size-5 shrink-0 text-brand" />
          These figures count the signed-off work on your sites.
        </p>
      ) : null}

      {metrics.isError && !m ? (
        <ErrorState title="Metrics did not load" error={metrics.error} onRetry={() => void metrics.refetch()} isRetrying={metrics.isFetching} />
      ) : !m ? (
        <LoadingRegion label="Loading metrics" className="flex flex-col gap-4">
          <div className="grid grid-cols-1 gap-4 sm:grid-cols-2 lg:grid-cols-4">
            {Array.from({ length: 4 }, (_, k) => (
              <Skeleton key={k} className="h-32 rounded-card" />
            ))}
          </div>
          <div className="grid gap-4 lg:grid-cols-2">
            <Skeleton className="h-80 rounded-card" />
            <Skeleton className="h-80 rounded-card" />
          </div>
        </LoadingRegion>
      ) : (
        <div aria-busy={metrics.isPlaceholderData || undefined} className={cn('flex flex-col gap-4 transition-opacity', metrics.isPlaceholderData && 'opacity-60')}>
          <p className="sr-only" aria-live="polite">
            Showing {periodText}
          </p>
          <div className="grid grid-cols-2 gap-3 sm:gap-4 lg:grid-cols-4">
            <StatCard
              icon="clock"
              label="Overdue now"
              value={formatNumber(m.overdueCount)}
              tone={m.overdueCount > 0 ? 'fail' : 'neutral'}
              detail={m.overdueCount > 0 ? 'Open tickets past their repair deadline' : 'No open ticket is past its deadline'}
            />
            <StatCard
              icon="check"
              label="First-time fix"
              value={formatRate(m.firstTimeFix.rate)}
              tone={m.firstTimeFix.rate !== null && m.firstTimeFix.rate >= 0.9 ? 'pass' : 'neutral'}
              detail={
                m.firstTimeFix.signedOff === 0
                  ? 'Nothing signed off in the period'
                  : `${formatNumber(m.firstTimeFix.withoutReturn)} of ${formatNumber(m.firstTimeFix.signedOff)} signed off without a return`
              }
            />
            <StatCard icon="clipboard" label="Open now" value={formatNumber(totalOpen(m))} detail="Tickets still needing work, any age" />
            <StatCard icon="refresh" label="Repeat faults" value={formatNumber(m.repeatFaults.length)} detail="Strings faulted again within 90 days of a sign-off" />
          </div>

          <div className="grid gap-4 lg:grid-cols-2">
            <ChartPanel
              title="Open tickets by state"
              description="Now, with their average age"
              summary={`Open tickets by state: ${open.map((o) => `${o.label} ${o.count}`).join(', ')}.`}
              isEmpty={totalOpen(m) === 0}
              emptyText={isOwner ? 'Open tickets are not shown to owners; signed-off work is.' : 'No ticket is open.'}
              chart={<OpenByStatusChart rows={open} />}
              table={
                <FigureTable
                  caption="Open tickets by state, now"
                  headers={['State', 'Tickets', 'Average age']}
                  rows={open.map((o) => [o.label, formatNumber(o.count), o.count ? formatDuration(o.averageAgeHours) : '–'])}
                />
              }
            />
            <ChartPanel
              title="Top fault categories"
              description={`Tickets reported, ${periodText.toLowerCase()}`}
              summary={`Top fault categories: ${top.map((t) => `${t.label} ${t.count}`).join(', ')}.`}
              isEmpty={top.length === 0}
              emptyText="No ticket was reported in this period."
              chartHeight={Math.max(180, top.length * 34 + 40)}
              chart={<CountBarChart rows={top} name="Tickets" />}
              table={<FigureTable caption={`Tickets by fault category, ${periodText}`} headers={['Fault category', 'Tickets']} rows={top.map((t) => [t.label, formatNumber(t.count)])} />}
            />
          </div>

          <ChartPanel
            title="Mean time to dispatch, repair and sign-off"
            description="Hours from the report, per site and fault category; a step no ticket reached yet is left out"
            summary={`Mean times for ${means.length} site and category combinations. Use Show as table for the figures.`}
            isEmpty={means.length === 0}
            emptyText="No ticket was reported in this period."
            chartHeight={Math.max(200, means.length * 46 + 60)}
            chart={<MeanTimesChart rows={means} />}
            table={
              <FigureTable
                caption={`Mean hours from report, per site and fault category, ${periodText}`}
                headers={['Site · fault category', 'Tickets', 'To dispatch', 'To repair', 'To sign-off']}
                rows={means.map((r) => [r.label, formatNumber(r.tickets), formatDuration(r.toDispatchHours), formatDuration(r.toRepairHours), formatDuration(r.toSignOffHours)])}
              />
            }
          />

          <ChartPanel
            title="Repeat faults"
            description="Strings with a new ticket within 90 days of a sign-off, most repeats first"
            summary={`Repeat faults: ${repeats
              .slice(0, 10)
              .map((r) => `${r.label} ${r.count}`)
              .join(', ')}.`}
            isEmpty={repeats.length === 0}
            emptyText="No string came back within 90 days. Good work."
            chartHeight={Math.max(140, Math.min(repeats.length, 15) * 34 + 40)}
            chart={<CountBarChart rows={repeats.slice(0, 15)} name="Repeats" />}
            table={
              <FigureTable
                caption={`Repeat faults, ${periodText}`}
                headers={['String', 'Repeats']}
                rows={repeats.map((r) => [
                  <Link key={r.stringId} to={paths.string(r.stringId)} className="font-mono text-brand underline underline-offset-2">
                    {r.label}
                  </Link>,
                  formatNumber(r.count),
                ])}
              />
            }
          />
        </div>
      )}
    </>
  );
}
