import { Icon } from '@/components/ui/icon';
import { cn } from '@/lib/cn';
import { formatDeviation, formatNumber } from '../lib/format';
import type { CheckPreview } from '../lib/preview';
import { VerdictBadge } from './verdict-badge';

function Row({ label, measured, expected, unit, deviation, decimals }: { label: string; measured: number | undefined; expected: number | null; unit: string; deviation: number | null; decimals: number }) {
  return (
    <tr className="border-t border-line">
      <th scope="row" className="py-2 pr-2 text-left font-semibold">
        {label}
      </th>
      <td className="readings py-2 pr-2 text-right">{measured !== undefined && Number.isFinite(measured) ? `${formatNumber(measured, decimals)} ${unit}` : '—'}</td>
      <td className="readings py-2 pr-2 text-right">{expected !== null ? `${formatNumber(expected, decimals)} ${unit}` : '—'}</td>
      <td className={cn('readings py-2 text-right font-semibold', deviation !== null && Math.abs(deviation) > 5 && 'text-fail')}>
        {deviation !== null ? formatDeviation(deviation) : '—'}
      </td>
    </tr>
  );
}

/**
 * The browser's reading of what was typed: expected Voc/Isc at those conditions, the deviations and
 * the engine's findings. Clearly a preview: the verdict that is stored comes from the server.
 */
export function LivePreview({ preview, vocV, iscA, moduleName, modulesInSeries }: { preview: CheckPreview | null; vocV: number | undefined; iscA: number | undefined; moduleName: string; modulesInSeries: number }) {
  return (
    <section aria-labelledby="live-preview-title" className="rounded-card border-2 border-dashed border-brand/50 bg-brand-soft/60 p-4">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h3 id="live-preview-title" className="text-lg font-bold">
          Preview
        </h3>
        {preview ? <VerdictBadge verdict={preview.verdict} prefix="Preview:" /> : null}
      </div>
      <p className="text-sm text-ink-muted">Preview; saved verdict comes from the server.</p>
      <p className="mt-1 text-sm text-ink-muted">
        {modulesInSeries} × {moduleName}
      </p>
      {/* Polite: the verdict changes as digits are typed, and a screen reader should hear where it settles. */}
      <div aria-live="polite" aria-atomic="true" className="mt-3">
        {preview === null ? (
          <p className="text-base text-ink-muted">
            {vocV === undefined
              ? 'Type the Voc to see the expected values and the verdict.'
              : 'The Voc typed is not a reading that can be judged (see the message under it); correct it to see the expected values and the verdict.'}
          </p>
        ) : (
          <>
            <table className="w-full text-base">
              <caption className="sr-only">Measured against expected at the typed conditions</caption>
              <thead>
                <tr className="text-left text-sm text-ink-muted">
                  <th scope="col" className="pb-1 font-semibold">
                    <span className="sr-only">Value</span>
                  </th>
                  <th scope="col" className="pb-1 pr-2 text-right font-semibold">
                    Measured
                  </th>
                  <th scope="col" className="pb-1 pr-2 text-right font-semibold">
                    Expected
                  </th>
                  <th scope="col" className="pb-1 text-right font-semibold">
                    Off by
                  </th>
                </tr>
              </thead>
              <tbody>
                <Row label="Voc" measured={vocV} expected={preview.expected?.vocV ?? null} unit="V" deviation={preview.vocDeviationPct} decimals={1} />
                <Row label="Isc" measured={iscA} expected={preview.expected?.iscA ?? null} unit="A" deviation={preview.iscDeviationPct} decimals={2} />
              </tbody>
            </table>
            {preview.expected === null ? <p className="mt-2 text-sm text-ink-muted">Enter the irradiance to get expected values.</p> : null}
            {preview.isTemperatureAssumed ? <p className="mt-2 text-sm text-ink-muted">No module temperature yet: expected values assume 25 °C.</p> : null}
            {preview.findings.length > 0 ? (
              <ul className="mt-3 flex flex-col gap-2">
                {preview.findings.map((f) => (
                  <li key={f.code + f.message} className="flex gap-2 text-base">
                    <Icon name={f.severity === 'fail' ? 'fail' : 'alert'} className={cn('mt-0.5 size-5', f.severity === 'fail' ? 'text-fail' : 'text-attention')} />
                    <span>{f.message}</span>
                  </li>
                ))}
              </ul>
            ) : (
              <p className="mt-3 flex gap-2 text-base">
                <Icon name="check" className="mt-0.5 size-5 text-pass" />
                Within tolerance of the datasheet at these conditions.
              </p>
            )}
          </>
        )}
      </div>
    </section>
  );
}
