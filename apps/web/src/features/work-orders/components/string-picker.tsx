import type { PvString } from '@stringfield/shared';
import { useEffect, useRef, useState } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Input } from '@/components/ui/form-field';
import { Icon } from '@/components/ui/icon';
import { Pagination } from '@/components/ui/pagination';
import { LoadingRegion, Skeleton } from '@/components/ui/skeleton';
import { cn } from '@/lib/cn';
import { useSiteStrings } from '../api/get-site-strings';

const PAGE_SIZE = 12;

/**
 * A site's strings, searched and paged by the server (a plant has hundreds), one checkbox each.
 * Ticks survive paging and searching: the selection lives with the form, not the page of results.
 */
export function StringPicker({
  siteId,
  selectedIds,
  onToggle,
  labelledBy,
}: {
  siteId: number;
  selectedIds: ReadonlySet<number>;
  onToggle: (string: PvString, isSelected: boolean) => void;
  labelledBy: string;
}) {
  const [query, setQuery] = useState('');
  const [q, setQ] = useState('');
  const [page, setPage] = useState(1);
  const timer = useRef<number | undefined>(undefined);
  useEffect(() => () => window.clearTimeout(timer.current), []);
  const strings = useSiteStrings(siteId, { q, page, pageSize: PAGE_SIZE });
  const items = strings.data?.items ?? [];
  const inService = items.filter((s) => !s.isArchived);
  const allOnPage = inService.length > 0 && inService.every((s) => selectedIds.has(s.id));

  return (
    <div className="flex flex-col gap-3 rounded-card border border-line bg-paper p-3">
      <div className="relative">
        <Icon
          name="search"
          className="pointer-events-none absolute top-1/2 left-3 -translate-y-1/2 text-ink-muted"
        />
        <Input
          type="search"
          aria-label="Search strings by label"
          placeholder="Label, like INV07-MPPT3"
          className="pl-10"
          value={query}
          autoComplete="off"
          spellCheck={false}
          onKeyDown={(event) => {
            // Enter searches at once instead of submitting the whole ticket form.
            if (event.key === 'Enter') {
              event.preventDefault();
              window.clearTimeout(timer.current);
              setQ(query);
              setPage(1);
            }
          }}
          onChange={(event) => {
            const next = event.target.value;
            setQuery(next);
            window.clearTimeout(timer.current);
            timer.current = window.setTimeout(() => {
              setQ(next);
              setPage(1);
            }, 300);
          }}
        />
      </div>

      {strings.isPending ? (
        <LoadingRegion label="Loading strings" className="flex flex-col gap-2">
          {Array.from({ length: 6 }, (_, i) => (
            <Skeleton key={i} className="h-touch" />
          ))}
        </LoadingRegion>
      ) : strings.isError && !strings.data ? (
        <Alert tone="fail" title="The strings did not load">
          <p>{strings.error.message}</p>
          <Button
            variant="secondary"
            className="mt-2"
            onClick={() => void strings.refetch()}
            isPending={strings.isFetching}
          >
            Try again
          </Button>
        </Alert>
      ) : items.length === 0 ? (
        <p className="px-1 py-4 text-center text-ink-muted">
          {q ? `No string label contains “${q}”.` : 'This site has no strings yet.'}
        </p>
      ) : (
        <>
          <div className="flex items-center justify-between gap-3 px-1">
            <label className="flex min-h-touch cursor-pointer items-center gap-3 font-semibold">
              <input
                type="checkbox"
                className="size-6 accent-brand"
                checked={allOnPage}
                onChange={(event) => inService.forEach((s) => onToggle(s, event.target.checked))}
              />
              All on this page
            </label>
          </div>
          <ul
            aria-labelledby={labelledBy}
            className={cn(
              'flex flex-col divide-y divide-line rounded-control border border-line bg-surface',
              strings.isPlaceholderData && 'opacity-60',
            )}
          >
            {items.map((s) => (
              <li key={s.id}>
                <label
                  className={cn(
                    'flex min-h-touch cursor-pointer items-center gap-3 px-3 py-2 hover:bg-sunken',
                    s.isArchived && 'cursor-not-allowed opacity-60',
                  )}
                >
                  <input
                    type="checkbox"
                    className="size-6 shrink-0 accent-brand"
                    checked={selectedIds.has(s.id)}
                    disabled={s.isArchived}
                    onChange={(event) => onToggle(s, event.target.checked)}
                  />
                  <span className="readings min-w-0 flex-1 font-semibold">
                    {s.label}
                    <span className="block text-sm font-normal text-ink-muted">
                      {s.inverterTag} · MPPT {s.mpptInput}
                      {s.combinerTag
                        ? ` · ${s.combinerTag}${s.combinerPosition ? ` #${s.combinerPosition}` : ''}`
                        : ''}
                      {s.isArchived ? ' · out of service' : ''}
                    </span>
                  </span>
                </label>
              </li>
            ))}
          </ul>
          {strings.data ? (
            <Pagination
              page={strings.data.page}
              pageSize={strings.data.pageSize}
              total={strings.data.total}
              itemLabel="strings"
              onPageChange={setPage}
            />
          ) : null}
        </>
      )}
    </div>
  );
}
