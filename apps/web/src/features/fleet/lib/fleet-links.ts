import { paths } from '@/config/paths';
import { fleetFiltersSearch, type FleetFilters } from './period';

/** The fleet tabs' targets, each carrying the filters that page understands. */
export function fleetTabLinks(filters: Partial<FleetFilters>) {
  const all = fleetFiltersSearch({ siteId: filters.siteId, faultCategory: filters.faultCategory, period: filters.period ?? { preset: '30d' } });
  return {
    overview: paths.fleet(),
    metrics: paths.fleetMetrics(all),
    energy: paths.fleetEnergy({ siteId: filters.siteId }),
    exports: paths.fleetExports({ ...all, faultCategory: undefined }),
  };
}
