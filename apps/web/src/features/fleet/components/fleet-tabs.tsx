import { NavLink } from 'react-router';
import { cn } from '@/lib/cn';

/**
 * Moves between the fleet pages, carrying the shared filters (site, period) along so a dispatcher
 * looking at FWM for the last 90 days stays on FWM for the last 90 days.
 */
export function FleetTabs({ links }: { links: { overview: string; metrics: string; energy: string; exports: string } }) {
  const tab = ({ isActive }: { isActive: boolean }) =>
    cn(
      'inline-flex min-h-touch shrink-0 items-center rounded-control border-2 px-4 font-semibold transition-colors',
      isActive ? 'border-brand bg-brand text-on-brand' : 'border-edge bg-surface text-ink hover:bg-sunken',
    );
  return (
    <nav aria-label="Fleet pages" className="-mx-1 mb-5 flex gap-2 overflow-x-auto px-1 pb-1">
      <NavLink to={links.overview} end className={tab}>
        Sites and maps
      </NavLink>
      <NavLink to={links.energy} className={tab}>
        Energy at risk
      </NavLink>
      <NavLink to={links.metrics} className={tab}>
        Metrics
      </NavLink>
      <NavLink to={links.exports} className={tab}>
        Exports
      </NavLink>
    </nav>
  );
}
