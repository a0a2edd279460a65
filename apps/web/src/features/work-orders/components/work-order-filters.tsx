import {
  can,
  openStatuses,
  faultCategories,
  faultCategoryLabels,
  priorities,
  priorityLabels,
  workOrderStatuses,
  workOrderStatusLabels,
  type FaultCategory,
  type Role,
} from '@stringfield/shared';
import { useEffect, useRef, useState } from 'react';
import { Button } from '@/components/ui/button';
import { Checkbox } from '@/components/ui/checkbox';
import { CheckboxMenu } from '@/components/ui/checkbox-menu';
import { FormField, Input, Select } from '@/components/ui/form-field';
import { Icon } from '@/components/ui/icon';
import { cn } from '@/lib/cn';
import { useSiteOptions } from '../api/get-sites';
import { useTechnicians } from '../api/get-technicians';
import type { AssigneeFilter, WorkOrderListParams, WorkOrderSort } from '../lib/list-params';

/* Sorting lives here as well as on the table headers: a phone shows cards, which have no headers. */
const sortLabels: Record<WorkOrderSort, string> = {
  dueAt: 'Soonest deadline',
  '-dueAt': 'Latest deadline',
  priority: 'P1 first',
  '-priority': 'P4 first',
  '-reportedAt': 'Newest reported',
  reportedAt: 'Oldest reported',
  '-signedOffAt': 'Latest signed off',
  signedOffAt: 'Earliest signed off',
  '-number': 'Highest number',
  number: 'Lowest number',
  status: 'Status, in order',
  '-status': 'Status, reversed',
};

const statusOptions = workOrderStatuses.map((value) => ({ value, label: workOrderStatusLabels[value] }));
const priorityOptions = priorities.map((value) => ({ value, label: priorityLabels[value] }));

function assigneeToValue(a: AssigneeFilter): string {
  return a === undefined ? '' : String(a);
}
function valueToAssignee(v: string): AssigneeFilter {
  if (v === '') return undefined;
  if (v === 'me' || v === 'none') return v;
  const n = Number(v);
  return Number.isInteger(n) && n > 0 ? n : undefined;
}

/** Every board filter; each change lands in the URL, so any view can be linked or bookmarked. The search waits for a pause in typing. */
export function WorkOrderFilters({
  value,
  role,
  hasFilters,
  onChange,
  onClear,
}: {
  value: WorkOrderListParams;
  role: Role;
  hasFilters: boolean;
  onChange: (next: Partial<WorkOrderListParams>, options?: { replace?: boolean }) => void;
  onClear: () => void;
}) {
  const sites = useSiteOptions();
  const canDispatch = can(role, 'workOrders:dispatch');
  const technicians = useTechnicians({ isEnabled: canDispatch });
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
    timer.current = window.setTimeout(() => onChange({ q: next }, { replace: true }), 300);
  };

  const isOwner = role === 'owner';
  const [isExpanded, setIsExpanded] = useState(false);
  const isOpenSet =
    value.status.length === openStatuses.length && openStatuses.every((st) => value.status.includes(st));

  return (
    <form
      role="search"
      aria-label="Filter work orders"
      className="mb-5 grid grid-cols-1 gap-x-4 gap-y-4 rounded-card border border-line bg-surface p-4 shadow-card sm:grid-cols-2 lg:grid-cols-4"
      onSubmit={(event) => {
        event.preventDefault();
        window.clearTimeout(timer.current);
        onChange({ q: query });
      }}
    >
      <FormField label="Search" className="sm:col-span-2">
        <div className="relative">
          <Icon
            name="search"
            className="pointer-events-none absolute top-1/2 left-3 -translate-y-1/2 text-ink-muted"
          />
          <Input
            type="search"
            placeholder="Number, title or string label"
            className="pl-10"
            value={query}
            onChange={(event) => scheduleSearch(event.target.value)}
            autoComplete="off"
            spellCheck={false}
            maxLength={100}
          />
        </div>
      </FormField>
      {/* On a phone the rest folds away behind one button, so the tickets start on the first screen. */}
      <Button
        variant="secondary"
        className="sm:hidden"
        aria-expanded={isExpanded}
        aria-controls="work-order-filter-fields"
        onClick={() => setIsExpanded((v) => !v)}
      >
        <Icon name="settings" />
        {isExpanded ? 'Hide filters' : hasFilters ? 'Filters and sort (on)' : 'Filters and sort'}
        <Icon name={isExpanded ? 'chevronUp' : 'chevronDown'} />
      </Button>
      <div id="work-order-filter-fields" className={cn(isExpanded ? 'contents' : 'hidden', 'sm:contents')}>
        {isOwner ? null : (
          <CheckboxMenu
            label="Status"
            options={statusOptions}
            value={value.status}
            onChange={(status) => onChange({ status })}
            allLabel="Every status"
            summary={isOpenSet ? `Open (${openStatuses.length} states)` : undefined}
          />
        )}
        <CheckboxMenu
          label="Priority"
          options={priorityOptions}
          value={value.priority}
          onChange={(priority) => onChange({ priority })}
          allLabel="Every priority"
        />
        <FormField label="Site">
          <Select
            value={value.siteId ?? ''}
            onChange={(event) =>
              onChange({ siteId: event.target.value ? Number(event.target.value) : undefined })
            }
          >
            <option value="">Every site</option>
            {(sites.data ?? []).map((site) => (
              <option key={site.id} value={site.id}>
                {site.code} · {site.name}
              </option>
            ))}
          </Select>
        </FormField>
        {isOwner ? null : (
          <FormField label="Technician">
            <Select
              value={assigneeToValue(value.assigneeId)}
              onChange={(event) => onChange({ assigneeId: valueToAssignee(event.target.value) })}
            >
              <option value="">Anyone</option>
              <option value="none">Unassigned</option>
              {role === 'technician' ? <option value="me">Me</option> : null}
              {(technicians.data ?? []).map((tech) => (
                <option key={tech.id} value={tech.id}>
                  {tech.name}
                </option>
              ))}
              {typeof value.assigneeId === 'number' &&
              !technicians.data?.some((t) => t.id === value.assigneeId) ? (
                <option value={value.assigneeId}>Technician #{value.assigneeId}</option>
              ) : null}
            </Select>
          </FormField>
        )}
        <FormField label="Fault category">
          <Select
            value={value.faultCategory ?? ''}
            onChange={(event) =>
              onChange({ faultCategory: (event.target.value || undefined) as FaultCategory | undefined })
            }
          >
            <option value="">Every category</option>
            {faultCategories.map((c) => (
              <option key={c} value={c}>
                {faultCategoryLabels[c]}
              </option>
            ))}
          </Select>
        </FormField>
        <FormField label="Sort by">
          <Select
            value={value.sort}
            onChange={(event) => onChange({ sort: event.target.value as WorkOrderSort })}
          >
            {(Object.keys(sortLabels) as WorkOrderSort[]).map((sort) => (
              <option key={sort} value={sort}>
                {sortLabels[sort]}
              </option>
            ))}
          </Select>
        </FormField>
        <div className="flex flex-wrap items-end justify-between gap-3 sm:col-span-2 lg:col-span-4">
          {isOwner ? (
            <span />
          ) : (
            <Checkbox
              label="Overdue only"
              checked={value.isOverdueOnly}
              onChange={(event) => onChange({ isOverdueOnly: event.target.checked })}
            />
          )}
          <Button
            variant="ghost"
            disabled={!hasFilters}
            onClick={() => {
              window.clearTimeout(timer.current);
              setQuery('');
              onClear();
            }}
          >
            <Icon name="close" /> Clear filters
          </Button>
        </div>
      </div>
    </form>
  );
}
