import { FormField, Select } from '@/components/ui/form-field';
import { siteSorts, type SiteSort } from '../lib/list-params';
import { ListSearch } from './list-search';

/* Sorting also lives here: a phone shows cards, which have no column headers. */
const sortLabels: Record<SiteSort, string> = { name: 'Name A–Z', '-name': 'Name Z–A', code: 'Code A–Z', '-code': 'Code Z–A' };

export function SitesFilters({ value, onChange }: { value: { q: string; sort: SiteSort }; onChange: (next: { q?: string; sort?: SiteSort }) => void }) {
  return (
    <div
      role="search"
      aria-label="Find a site"
      className="mb-5 grid gap-4 rounded-card border border-line bg-surface p-4 shadow-card sm:grid-cols-[minmax(0,2fr)_minmax(0,1fr)] sm:items-end"
    >
      <ListSearch placeholder="Site name or code" value={value.q} onSearch={(q) => onChange({ q })} />
      <FormField label="Sort by">
        <Select value={value.sort} onChange={(event) => onChange({ sort: event.target.value as SiteSort })}>
          {siteSorts.map((sort) => (
            <option key={sort} value={sort}>
              {sortLabels[sort]}
            </option>
          ))}
        </Select>
      </FormField>
    </div>
  );
}
