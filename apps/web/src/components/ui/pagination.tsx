import { cn } from '@/lib/cn';
import { Button } from './button';
import { Icon } from './icon';

/** Previous/next paging with "21–40 of 57", for server-paged lists. */
export function Pagination({
  page,
  pageSize,
  total,
  onPageChange,
  itemLabel = 'items',
  className,
}: {
  page: number;
  pageSize: number;
  total: number;
  onPageChange: (page: number) => void;
  itemLabel?: string;
  className?: string;
}) {
  const pageCount = Math.max(1, Math.ceil(total / pageSize));
  const first = total === 0 ? 0 : (page - 1) * pageSize + 1;
  const last = Math.min(total, page * pageSize);
  return (
    <nav aria-label="Pages" className={cn('flex flex-wrap items-center justify-between gap-3', className)}>
      <p className="readings text-ink-muted" aria-live="polite">
        {total === 0 ? `No ${itemLabel}` : `${first}–${last} of ${total} ${itemLabel}`}
      </p>
      <div className="flex items-center gap-2">
        <Button variant="secondary" onClick={() => onPageChange(page - 1)} disabled={page <= 1} aria-label="Previous page">
          <Icon name="chevronLeft" />
          <span className="hidden sm:inline">Previous</span>
        </Button>
        <span className="readings px-1 text-ink-muted">
          Page {Math.min(page, pageCount)} of {pageCount}
        </span>
        <Button variant="secondary" onClick={() => onPageChange(page + 1)} disabled={page >= pageCount} aria-label="Next page">
          <span className="hidden sm:inline">Next</span>
          <Icon name="chevronRight" />
        </Button>
      </div>
    </nav>
  );
}
