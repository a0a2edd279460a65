import { Link } from 'react-router';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { LoadingRegion, Skeleton } from '@/components/ui/skeleton';
import { paths, ticketAnchors } from '@/config/paths';
import { useStringDiodeReplacements } from '../api/get-string-diode-replacements';
import { DiodeRecordCard } from './diode-replacements-panel';

/** A string's bypass-diode replacements across its tickets, newest first, for the string page. */
export function StringDiodeHistory({ stringId }: { stringId: number }) {
  const records = useStringDiodeReplacements(stringId);
  if (records.isPending)
    return (
      <LoadingRegion label="Loading the diode replacements">
        <Skeleton className="h-32" />
      </LoadingRegion>
    );
  if (records.isError) return <ErrorState title="The diode replacements did not load" error={records.error} onRetry={() => void records.refetch()} isRetrying={records.isFetching} />;
  if (records.data.length === 0) return <EmptyState icon="bolt" headingLevel={3} title="No diode replacements" description="No bypass diode of this string has been replaced through Stringfield." />;
  const newestFirst = [...records.data].sort((a, b) => b.createdAt.localeCompare(a.createdAt));
  return (
    <ul className="flex flex-col gap-3">
      {newestFirst.map((r) => (
        <li key={r.id} className="flex flex-col gap-1">
          <DiodeRecordCard record={r} showTicket />
          <Link to={`${paths.workOrder(r.workOrderId)}#${ticketAnchors.diode(r.id)}`} className="inline-flex min-h-touch items-center self-start font-semibold text-brand underline underline-offset-4">
            Open {r.workOrderNumber}
          </Link>
        </li>
      ))}
    </ul>
  );
}
