import { useParams, useSearchParams } from 'react-router';
import { Alert } from '@/components/ui/alert';
import { Button, ButtonLink } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { FormField, Select } from '@/components/ui/form-field';
import { Icon } from '@/components/ui/icon';
import { PageHeader } from '@/components/ui/page-header';
import { LoadingRegion, Skeleton } from '@/components/ui/skeleton';
import { LoadError } from '@/features/assets/components/load-error';
import { paths, toSearch } from '@/config/paths';
import { useAllSiteStrings } from '@/features/assets/api/get-all-site-strings';
import { useCombinerBoxes } from '@/features/assets/api/get-combiner-boxes';
import { useInverters } from '@/features/assets/api/get-inverters';
import { useSite } from '@/features/assets/api/get-site';
import { QrLabelSheet } from '@/features/assets/components/qr-label-sheet';
import { parseId } from '@/features/assets/lib/parse-id';
import { NotFoundContent } from './not-found';

export function SiteLabelsRoute() {
  const siteId = parseId(useParams().siteId);
  if (siteId === null) return <NotFoundContent />;
  return <SiteLabelsPage key={siteId} siteId={siteId} />;
}

/** A printable A4 sheet of QR labels for the strings (one inverter or all) and the combiner boxes. */
function SiteLabelsPage({ siteId }: { siteId: number }) {
  const [searchParams, setSearchParams] = useSearchParams();
  const inverterId = parseId(searchParams.get('inverterId') ?? undefined) ?? undefined;
  const withBoxes = searchParams.get('boxes') !== 'no';
  const site = useSite(siteId);
  const inverters = useInverters(siteId);
  const boxes = useCombinerBoxes(siteId);
  const strings = useAllSiteStrings(siteId, { inverterId });

  const setFilter = (changes: { inverterId?: number; boxes?: 'no' }) =>
    setSearchParams(toSearch({ inverterId, boxes: withBoxes ? undefined : 'no', ...changes }), { replace: true, preventScrollReset: true });

  if (site.isPending)
    return (
      <LoadingRegion label="Loading the site" className="flex flex-col gap-4">
        <Skeleton className="h-9 w-72" />
        <Skeleton className="h-24 rounded-card" />
      </LoadingRegion>
    );
  if (site.isError) return <LoadError what="site" error={site.error} onRetry={() => void site.refetch()} isRetrying={site.isFetching} backTo={paths.sites()} backLabel="Go to Sites" />;

  const s = site.data;
  const selected = inverters.data?.find((i) => i.id === inverterId);
  // Combiner boxes carry no inverter, so a sheet for one inverter shows the boxes its strings land in.
  const boxIds = new Set(strings.data?.items.map((x) => x.combinerBoxId).filter((id) => id !== null));
  const boxList = withBoxes ? (boxes.data ?? []).filter((b) => inverterId === undefined || boxIds.has(b.id)) : [];
  const stringList = strings.data?.items ?? [];
  const labelCount = stringList.length + boxList.length;

  return (
    <>
      <div className="label-sheet-screen-only">
        <nav aria-label="Breadcrumb" className="mb-2">
          <ButtonLink to={paths.site(s.id)} variant="ghost" className="-ml-4 text-brand">
            <Icon name="chevronLeft" /> {s.name}
          </ButtonLink>
        </nav>
        <PageHeader
          eyebrow={<span className="readings font-mono">{s.code}</span>}
          title="QR labels"
          description="Stick one on each string's cable tag and combiner box: a phone camera opens the string page straight away."
          actions={
            <Button variant="primary" onClick={() => window.print()} disabled={labelCount === 0}>
              <Icon name="file" /> Print {labelCount} {labelCount === 1 ? 'label' : 'labels'}
            </Button>
          }
        />
        <div className="mb-6 grid gap-4 rounded-card border border-line bg-surface p-4 shadow-card sm:grid-cols-[minmax(0,1fr)_auto] sm:items-end">
          <FormField label="Strings of">
            <Select value={inverterId ?? ''} onChange={(event) => setFilter({ inverterId: event.target.value ? Number(event.target.value) : undefined })}>
              <option value="">Every inverter ({s.stringCount} strings)</option>
              {(inverters.data ?? []).map((inverter) => (
                <option key={inverter.id} value={inverter.id}>
                  {inverter.tag} ({inverter.stringCount} strings)
                </option>
              ))}
            </Select>
          </FormField>
          <label className="inline-flex min-h-touch cursor-pointer items-center gap-3 font-semibold">
            <input type="checkbox" className="size-6 accent-brand" checked={withBoxes} onChange={(e) => setFilter({ boxes: e.target.checked ? undefined : 'no' })} />
            Combiner boxes too
          </label>
        </div>
        <Alert tone="info" className="mb-6">
          Prints on A4, three labels across ({Math.ceil(labelCount / 24)} {Math.ceil(labelCount / 24) === 1 ? 'page' : 'pages'} at up to 24 a page). Set the printer to 100 % scale so
          the codes stay at 27 mm.
        </Alert>
      </div>

      <div aria-live="polite" className="sr-only">
        {strings.data ? `${labelCount} labels ready${selected ? ` for ${selected.tag}` : ''}` : ''}
      </div>
      {strings.isPending ? (
        <LoadingRegion label="Preparing labels" className="grid gap-3 sm:grid-cols-2 xl:grid-cols-3">
          {Array.from({ length: 6 }, (_, k) => (
            <Skeleton key={k} className="h-36 rounded-control" />
          ))}
        </LoadingRegion>
      ) : strings.isError ? (
        <ErrorState title="The strings did not load" error={strings.error} onRetry={() => void strings.refetch()} isRetrying={strings.isFetching} />
      ) : labelCount === 0 ? (
        <EmptyState icon="file" title="Nothing to label yet" description="This site has no strings or combiner boxes registered." />
      ) : (
        <QrLabelSheet
          origin={window.location.origin}
          siteCode={s.code}
          strings={stringList}
          combinerBoxes={boxList}
          stringPath={(id) => paths.string(id)}
          combinerPath={() => paths.site(s.id)}
        />
      )}
    </>
  );
}
