import { roleLabels, roles, type Role } from '@stringfield/shared';
import { useEffect, useRef, useState } from 'react';
import { Button } from '@/components/ui/button';
import { FormField, Input, Select } from '@/components/ui/form-field';
import { Icon } from '@/components/ui/icon';
import type { UserSort, UserStatusFilter } from '../lib/list-params';

const statusLabels: Record<UserStatusFilter, string> = { all: 'Everyone', active: 'Active only', inactive: 'Deactivated only' };

/* Sorting lives here as well as on the table headers: a phone shows cards, which have no headers. */
const sortLabels: Record<UserSort, string> = {
  name: 'Name A–Z',
  '-name': 'Name Z–A',
  email: 'E-mail A–Z',
  '-email': 'E-mail Z–A',
  role: 'Role A–Z',
  '-role': 'Role Z–A',
  '-createdAt': 'Newest first',
  createdAt: 'Oldest first',
};

type Filters = { q: string; role: Role | undefined; status: UserStatusFilter; sort: UserSort };

/** Search, role and status filters; the search waits for a pause in typing before it asks the server. */
export function UsersFilters({ value, onChange }: { value: Filters; onChange: (next: Partial<Filters>) => void }) {
  const [query, setQuery] = useState(value.q);
  const [syncedQ, setSyncedQ] = useState(value.q);
  const timer = useRef<number | undefined>(undefined);

  // Back/forward can change q under us; follow it (React's "adjust state on prop change" pattern).
  if (value.q !== syncedQ) {
    setSyncedQ(value.q);
    setQuery(value.q);
  }

  useEffect(() => () => window.clearTimeout(timer.current), []);

  const scheduleSearch = (next: string) => {
    setQuery(next);
    window.clearTimeout(timer.current);
    timer.current = window.setTimeout(() => onChange({ q: next }), 300);
  };

  const hasFilters = value.q !== '' || value.role !== undefined || value.status !== 'all';

  return (
      <form
        role="search"
        aria-label="Filter people"
        className="mb-5 grid grid-cols-2 gap-x-3 gap-y-4 rounded-card border border-line bg-surface p-4 shadow-card sm:gap-x-4 lg:grid-cols-[minmax(0,1.6fr)_repeat(3,minmax(0,1fr))_auto] lg:items-end"
        onSubmit={(event) => {
          event.preventDefault();
          window.clearTimeout(timer.current);
          onChange({ q: query });
        }}
      >
        <FormField label="Search" className="col-span-2 lg:col-span-1">
          <div className="relative">
            <Icon name="search" className="pointer-events-none absolute top-1/2 left-3 -translate-y-1/2 text-ink-muted" />
            <Input
              type="search"
              placeholder="Name or e-mail"
              className="pl-10"
              value={query}
              onChange={(event) => scheduleSearch(event.target.value)}
              autoComplete="off"
              spellCheck={false}
            />
          </div>
        </FormField>
        <FormField label="Role">
          <Select value={value.role ?? ''} onChange={(event) => onChange({ role: (event.target.value || undefined) as Role | undefined })}>
            <option value="">Every role</option>
            {roles.map((role) => (
              <option key={role} value={role}>
                {roleLabels[role]}
              </option>
            ))}
          </Select>
        </FormField>
        <FormField label="Status">
          <Select value={value.status} onChange={(event) => onChange({ status: event.target.value as UserStatusFilter })}>
            {(Object.keys(statusLabels) as UserStatusFilter[]).map((status) => (
              <option key={status} value={status}>
                {statusLabels[status]}
              </option>
            ))}
          </Select>
        </FormField>
        <FormField label="Sort by">
          <Select value={value.sort} onChange={(event) => onChange({ sort: event.target.value as UserSort })}>
            {(Object.keys(sortLabels) as UserSort[]).map((sort) => (
              <option key={sort} value={sort}>
                {sortLabels[sort]}
              </option>
            ))}
          </Select>
        </FormField>
        <Button
          variant="ghost"
          disabled={!hasFilters}
          onClick={() => {
            window.clearTimeout(timer.current);
            setQuery('');
            onChange({ q: '', role: undefined, status: 'all' });
          }}
        >
          Clear filters
        </Button>
      </form>
  );
}
