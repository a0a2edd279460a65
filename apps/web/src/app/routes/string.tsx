import { Link, useParams } from 'react-router';
import { Alert } from '@/components/ui/alert';
import { Badge } from '@/components/ui/badge';
import { Icon } from '@/components/ui/icon';
import { PageHeader } from '@/components/ui/page-header';
import { LoadingRegion, Skeleton } from '@/components/ui/skeleton';
import { LoadError } from '@/features/assets/components/load-error';
import { StringDiodeHistory } from '@/features/evidence/components/string-diode-history';
import { paths } from '@/config/paths';
import { useString } from '@/features/assets/api/get-string';
import { SizingChecksTable } from '@/features/assets/components/sizing-checks-table';
import { StringFacts } from '@/features/assets/components/string-facts';
import { StringWorkbench } from '@/features/assets/components/string-workbench';
import { parseId } from '@/features/assets/lib/parse-id';
import { NotFoundContent } from './not-found';

export function StringRoute() {
  const stringId = parseId(useParams().stringId);
  if (stringId === null) return <NotFoundContent />;
  return <StringPage key={stringId} stringId={stringId} />;
}

/** One string, as a QR label opens it: datasheet, inverter window, expected values, checks, what-if. */
function StringPage({ stringId }: { stringId: number }) {
  const string = useString(stringId);

  if (string.isPending)
    return (
      <LoadingRegion label="Loading the string" className="flex flex-col gap-4">
        <Skeleton className="h-5 w-40" />
        <Skeleton className="h-9 w-72" />
        <div className="grid gap-4 lg:grid-cols-3">
          <Skeleton className="h-64 rounded-card" />
          <Skeleton className="h-64 rounded-card" />
          <Skeleton className="h-64 rounded-card" />
        </div>
      </LoadingRegion>
    );
  if (string.isError)
    return <LoadError what="string" error={string.error} onRetry={() => void string.refetch()} isRetrying={string.isFetching} backTo={paths.sites()} backLabel="Go to Sites" />;

  const s = string.data;
  const failing = s.sizing.filter((c) => !c.ok).length;

  return (
    <>
      <nav aria-label="Breadcrumb" className="mb-2">
        <Link to={paths.site(s.site.id, { inverterId: s.inverterId })} className="inline-flex min-h-touch items-center gap-1 font-semibold text-brand underline-offset-4 hover:underline">
          <Icon name="chevronLeft" />
          {s.site.name} · {s.inverterTag}
        </Link>
      </nav>
      <PageHeader
        eyebrow={<span className="readings font-mono">{s.site.code}</span>}
        title={s.label}
        description={
          <span className="flex flex-wrap items-center gap-2">
            <span className="readings">
              {s.modulesInSeries} × {s.module.maker} {s.module.model} on {s.inverterTag} input {s.mpptInput}
            </span>
            {failing === 0 ? <Badge tone="pass">Sizing ok</Badge> : <Badge tone="fail">Fails {failing} sizing {failing === 1 ? 'check' : 'checks'}</Badge>}
            {s.isArchived ? <Badge tone="neutral" icon="lock">Archived</Badge> : null}
          </span>
        }
      />

      <Alert tone="info" title="Modelled values" className="mb-6">
        Expected values and curves come from the module datasheet and a single-diode model, not from a measurement. Field readings depend on the accuracy of your meter,
        irradiance sensor and temperature probe. The local electrical code, the authority having jurisdiction and the manufacturers&apos; instructions rule wherever they differ.
      </Alert>

      <section aria-label="Datasheet and inverter input" className="mb-8">
        <StringFacts string={s} />
      </section>

      <section aria-labelledby="checks-heading" className="mb-8">
        <h2 id="checks-heading" className="mb-1 text-xl font-semibold">
          Sizing checks
        </h2>
        <p className="mb-3 max-w-prose text-ink-muted">
          Against the inverter input for {s.site.code}&apos;s range of {s.site.lowestAmbientC} °C to {s.site.highestAmbientC} °C at {s.site.designIrradianceWm2} W/m².
        </p>
        <SizingChecksTable checks={s.sizing} />
      </section>

      <StringWorkbench string={s} />

      <section aria-labelledby="diode-history-heading" className="mt-8">
        <h2 id="diode-history-heading" className="mb-1 text-xl font-semibold">
          Diode replacements
        </h2>
        <p className="mb-3 max-w-prose text-ink-muted">Bypass diodes replaced on this string, with the parts and the Voc before and after.</p>
        <StringDiodeHistory stringId={s.id} />
      </section>
    </>
  );
}
