import type { StringCheck } from '@stringfield/shared';
import { lazy, Suspense, useId, useMemo, useRef, useState } from 'react';
import { toast } from '@/lib/toast';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { ErrorState } from '@/components/ui/error-state';
import { Icon } from '@/components/ui/icon';
import { LoadingRegion, Skeleton } from '@/components/ui/skeleton';
import { useIvTrace } from '../api/get-iv-trace';
import { useUploadIvTrace } from '../api/upload-iv-trace';
import { useIsOnline } from '../hooks/use-is-online';
import { formatNumber } from '../lib/format';
import { downsample, healthyCurveAt, powerRatioPct } from '../lib/iv-curves';
import type { StringSpec } from '../lib/string-spec';

const IvTraceChart = lazy(() => import('./iv-trace-chart'));

function Fact({ label, value }: { label: string; value: string }) {
  return (
    <div>
      <dt className="text-sm text-ink-muted">{label}</dt>
      <dd className="readings text-lg font-semibold">{value}</dd>
    </div>
  );
}

/**
 * The I-V trace of a saved check: upload the tracer's CSV, then the curve against the healthy string
 * modelled at the same conditions and its STC translation, with the numbers the server found.
 */
export function IvTracePanel({ check, spec, canUpload }: { check: StringCheck; spec: StringSpec; canUpload: boolean }) {
  const trace = useIvTrace(check.id, { enabled: check.hasIvTrace });
  const upload = useUploadIvTrace(check.workOrderId);
  const isOnline = useIsOnline();
  const inputId = useId();
  const fileRef = useRef<HTMLInputElement>(null);
  const [file, setFile] = useState<File | null>(null);
  const data = upload.data ?? trace.data;

  const healthy = useMemo(() => (data ? healthyCurveAt(spec, data.irradianceWm2, data.cellTempC) : null), [data, spec]);

  const send = () => {
    if (!file) return;
    upload.mutate(
      { checkId: check.id, file },
      {
        onSuccess: () => {
          toast.success('I-V trace analysed');
          setFile(null);
          if (fileRef.current) fileRef.current.value = '';
        },
      },
    );
  };

  const ratio = data ? powerRatioPct(data.analysis.pmpW, healthy?.pmpW) : null;

  return (
    <section aria-labelledby={`iv-${check.id}-title`} className="flex flex-col gap-3 rounded-card border border-line bg-surface p-4">
      <h3 id={`iv-${check.id}-title`} className="text-lg font-bold">
        I-V trace
      </h3>

      {canUpload ? (
        <div className="flex flex-col gap-2">
          <label htmlFor={inputId} className="font-semibold">
            {data ? 'Replace with another CSV from the tracer' : 'CSV from the I-V tracer'}
          </label>
          <input
            ref={fileRef}
            id={inputId}
            type="file"
            accept=".csv,text/csv"
            onChange={(e) => {
              upload.reset();
              setFile(e.target.files?.[0] ?? null);
            }}
            className="block min-h-touch w-full rounded-control border-2 border-edge bg-surface p-2 text-base file:mr-3 file:min-h-10 file:rounded-control file:border-0 file:bg-brand file:px-4 file:font-semibold file:text-on-brand"
          />
          <Button variant="brand" onClick={send} disabled={!file || !isOnline} isPending={upload.isPending}>
            {upload.isPending ? null : <Icon name="send" />}
            Upload and analyse
          </Button>
          {!isOnline ? <p className="text-sm text-ink-muted">Uploading a trace needs a connection; the file stays on the tracer.</p> : null}
        </div>
      ) : null}
      <div aria-live="polite">
        {upload.isError ? (
          <Alert tone="fail" title="The trace was not accepted">
            {upload.error.message}
          </Alert>
        ) : null}
      </div>

      {check.hasIvTrace && trace.isPending && !upload.data ? (
        <LoadingRegion label="Loading the I-V trace">
          <Skeleton className="h-72 w-full" />
        </LoadingRegion>
      ) : null}
      {trace.isError && !data ? <ErrorState title="The trace did not load" error={trace.error} onRetry={() => void trace.refetch()} isRetrying={trace.isFetching} /> : null}
      {!data && !check.hasIvTrace && !canUpload ? <p className="text-ink-muted">No trace was attached to this check.</p> : null}

      {data ? (
        <>
          <p className="text-sm text-ink-muted">
            {data.fileName} · {formatNumber(data.irradianceWm2, 0)} W/m² · {formatNumber(data.cellTempC, 1)} °C cell · {data.points.length} points
          </p>
          <Suspense
            fallback={
              <LoadingRegion label="Drawing the chart">
                <Skeleton className="h-72 w-full" />
              </LoadingRegion>
            }
          >
            <IvTraceChart measured={downsample(data.points)} healthy={healthy?.curve ?? null} stc={downsample(data.stcPoints)} steps={data.analysis.steps} />
          </Suspense>
          <p className="text-sm text-ink-muted">
            Solid copper: measured. Dashed: a healthy string of {spec.modulesInSeries} × {spec.moduleName} modelled at the same irradiance and temperature. Teal: the measured curve translated to STC.
            {data.analysis.steps.length > 0 ? ' Red dots: steps in the curve.' : ''}
          </p>
          <dl className="grid grid-cols-2 gap-3 sm:grid-cols-4">
            <Fact label="Pmp measured" value={`${formatNumber(data.analysis.pmpW, 0)} W`} />
            <Fact label="Pmp of a healthy string" value={healthy ? `${formatNumber(healthy.pmpW, 0)} W` : '—'} />
            <Fact label="Share of healthy" value={ratio === null ? '—' : `${formatNumber(ratio, 1)} %`} />
            <Fact label="Fill factor" value={formatNumber(data.analysis.fillFactor, 3)} />
            <Fact label="Voc / Isc measured" value={`${formatNumber(data.analysis.vocV, 1)} V / ${formatNumber(data.analysis.iscA, 2)} A`} />
            <Fact label="Steps found" value={String(data.analysis.steps.length)} />
            <Fact label="Likely bypassed substrings" value={String(data.analysis.likelyBypassedSubstrings)} />
            <Fact label="Pmp at STC" value={`${formatNumber(data.stcAnalysis.pmpW, 0)} W`} />
          </dl>
          {data.analysis.steps.length > 0 ? (
            <p className="text-base">
              Steps at {data.analysis.steps.map((s) => `${formatNumber(s.atV, 0)} V / ${formatNumber(s.atA, 2)} A`).join(', ')}: a step is the signature of a bypass diode conducting
              {data.analysis.likelyBypassedSubstrings > 0 ? `, about ${data.analysis.likelyBypassedSubstrings} substring${data.analysis.likelyBypassedSubstrings === 1 ? '' : 's'} bypassed` : ''}.
            </p>
          ) : (
            <p className="text-base">No steps: no bypass diode conducts along the curve.</p>
          )}
          <div className="rounded-control bg-sunken p-3 text-sm">
            <p className="font-semibold">Translation to STC</p>
            <p>
              IEC 60891 procedure {data.translation.procedure}, Rs {formatNumber(data.translation.seriesOhm, 3)} Ω, κ {formatNumber(data.translation.kappaOhmPerC, 4)} Ω/°C
              {data.translation.isApproximate ? ' — approximate (κ not measured for this module).' : '.'}
            </p>
          </div>
        </>
      ) : null}
    </section>
  );
}
