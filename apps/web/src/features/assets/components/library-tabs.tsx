import { NavLink } from 'react-router';
import { paths } from '@/config/paths';
import { cn } from '@/lib/cn';

/** Switches between the two datasheet libraries. */
export function LibraryTabs() {
  const tab = ({ isActive }: { isActive: boolean }) =>
    cn(
      'inline-flex min-h-touch items-center rounded-control border-2 px-4 font-semibold transition-colors',
      isActive ? 'border-brand bg-brand text-on-brand' : 'border-edge bg-surface text-ink hover:bg-sunken',
    );
  return (
    <nav aria-label="Datasheet libraries" className="mb-5 flex flex-wrap gap-2">
      <NavLink to={paths.moduleModels()} className={tab}>
        Modules
      </NavLink>
      <NavLink to={paths.inverterModels()} className={tab}>
        Inverters
      </NavLink>
    </nav>
  );
}
