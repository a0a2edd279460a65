import { Link } from 'react-router';
import { Alert } from '@/components/ui/alert';
import { ErrorState } from '@/components/ui/error-state';
import { LoadingRegion, Skeleton } from '@/components/ui/skeleton';
import { useAllSiteStrings } from '../api/get-all-site-strings';
import { countSizingFailures, sizingHeadline } from '../lib/sizing-summary';

/**
 * "24 of 192 strings fail …", then each failing check with how many strings miss it. Counted from
 * the failing strings themselves, so the numbers match the filtered table below.
 */
export function SizingSummary({ siteId, stringCount, failingHref }: { siteId: number; stringCount: number; failingHref: string }) {
  const failing = useAllSiteStrings(siteId, { sizing: 'fail' }, { enabled: stringCount > 0 });

  if (stringCount === 0) return null;
  if (failing.isPending)
    return (
      <LoadingRegion label="Counting sizing failures" className="rounded-control border-2 border-line p-3">
        <Skeleton className="h-6 w-2/3" />
        <Skeleton className="mt-2 h-5 w-1/2" />
      </LoadingRegion>
    );
  if (failing.isError) return <ErrorState title="The sizing summary did not load" error={failing.error} onRetry={() => void failing.refetch()} isRetrying={failing.isFetching} />;

  const { items, total } = failing.data;
  const headline = sizingHeadline(total, stringCount);
  if (total === 0) return <Alert tone="pass" title={headline}>Cold Voc, hot Vmp, currents and power are inside the inverter limits for this site&apos;s ambient range.</Alert>;

  const counts = countSizingFailures(items);
  return (
    <Alert tone="attention" title={`${headline}.`}>
      <p>These checks are not met (strings can miss more than one):</p>
      <ul className="mt-1 list-disc pl-5">
        {counts.map((c) => (
          <li key={c.code}>
            <span className="font-semibold">{c.label}</span>: not met by <span className="readings">{c.count}</span> {c.count === 1 ? 'string' : 'strings'}
          </li>
        ))}
      </ul>
      <p className="mt-2">
        <Link to={failingHref} className="inline-flex min-h-touch items-center font-semibold text-brand underline underline-offset-4">
          Show the {total} failing {total === 1 ? 'string' : 'strings'}
        </Link>
      </p>
    </Alert>
  );
}
