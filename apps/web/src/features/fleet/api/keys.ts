import type { MetricsQuery } from '@stringfield/shared';

/**
 * Query keys of the fleet view, from one place. A change of a site's peak sun hours invalidates
 * `fleetKeys.sites()` and `fleetKeys.energy()` together; nothing else depends on it.
 */
export const fleetKeys = {
  all: ['fleet'] as const,
  sites: () => [...fleetKeys.all, 'sites'] as const,
  healthMaps: () => [...fleetKeys.all, 'health-map'] as const,
  healthMap: (siteId: number) => [...fleetKeys.healthMaps(), siteId] as const,
  energy: () => [...fleetKeys.all, 'energy-at-risk'] as const,
  energyFor: (siteId: number | undefined) => [...fleetKeys.energy(), siteId ?? 'all'] as const,
  metrics: () => [...fleetKeys.all, 'metrics'] as const,
  metricsFor: (query: MetricsQuery) => [...fleetKeys.metrics(), query] as const,
};
