import { irradianceMethodLabels, moduleTempMethodLabels, type StringCheck } from '@stringfield/shared';
import type { ReactNode } from 'react';
import { Icon } from '@/components/ui/icon';
import { cn } from '@/lib/cn';
import { formatDeviation, formatNumber, formatTakenAt } from '../lib/format';
import { VerdictBadge } from './verdict-badge';

function Fact({ label, children }: { label: string; children: ReactNode }) {
  return (
    <div className="flex flex-col">
      <dt className="text-sm text-ink-muted">{label}</dt>
      <dd className="readings text-lg font-semibold">{children}</dd>
    </div>
  );
}

const num = (v: number | null, unit: string, decimals = 1) => (v === null ? '—' : `${formatNumber(v, decimals)} ${unit}`);

/**
 * A saved check as the server judged it: the stored verdict, each finding in one sentence, the
 * measured and expected values, and the peer strings it was compared with.
 */
export function CheckResult({ check, actions }: { check: StringCheck; actions?: ReactNode }) {
  return (
    <section aria-labelledby={`check-${check.id}-title`} className="flex flex-col gap-4 rounded-card border-2 border-line bg-surface p-4 shadow-card">
      <div className="flex flex-wrap items-start justify-between gap-2">
        <div>
          <h3 id={`check-${check.id}-title`} className="text-lg font-bold">
            Saved verdict
          </h3>
          <p className="text-sm text-ink-muted">
            {check.phase === 'before' ? 'Before repair' : 'After repair'} · {formatTakenAt(check.takenAt)} · {check.technician.name} · from the server (engine {check.engineVersion})
          </p>
        </div>
        <VerdictBadge verdict={check.verdict} isLarge />
      </div>

      {check.findings.length > 0 ? (
        <ul className="flex flex-col gap-2" aria-label="Findings">
          {check.findings.map((f, index) => (
            <li key={`${f.code}-${index}`} className={cn('flex gap-2 rounded-control border-l-4 p-2 text-base', f.severity === 'fail' ? 'border-fail bg-fail-soft' : 'border-attention bg-attention-soft')}>
              <Icon name={f.severity === 'fail' ? 'fail' : 'alert'} className={cn('mt-0.5 size-5', f.severity === 'fail' ? 'text-fail' : 'text-attention')} />
              <span>{f.message}</span>
            </li>
          ))}
        </ul>
      ) : (
        <p className="flex gap-2 rounded-control border-l-4 border-pass bg-pass-soft p-2">
          <Icon name="check" className="mt-0.5 size-5 text-pass" /> No findings: the string reads as expected at these conditions.
        </p>
      )}

      <dl className="grid grid-cols-2 gap-3 sm:grid-cols-4">
        <Fact label="Voc measured">{num(check.vocV, 'V')}</Fact>
        <Fact label="Voc expected">{check.expected ? num(check.expected.vocV, 'V') : '—'}</Fact>
        <Fact label="Voc off by">{check.vocDeviationPct === null ? '—' : formatDeviation(check.vocDeviationPct)}</Fact>
        <Fact label="Polarity">{check.polarityCorrect ? 'Correct' : 'Reversed'}</Fact>
        <Fact label="Isc measured">{num(check.iscA, 'A', 2)}</Fact>
        <Fact label="Isc expected">{check.expected ? num(check.expected.iscA, 'A', 2) : '—'}</Fact>
        <Fact label="Isc off by">{check.iscDeviationPct === null ? '—' : formatDeviation(check.iscDeviationPct)}</Fact>
        <Fact label="Irradiance">{num(check.irradianceWm2, 'W/m²', 0)}</Fact>
        <Fact label="Module temp.">{num(check.moduleTempC, '°C')}</Fact>
        <Fact label="Ambient">{num(check.ambientC, '°C')}</Fact>
        <Fact label="Insulation + / −">
          {check.insulationPlusMOhm === null && check.insulationMinusMOhm === null
            ? '—'
            : `${check.insulationPlusMOhm ?? '—'} / ${check.insulationMinusMOhm ?? '—'} MΩ${check.insulationTestVoltageV ? ` at ${check.insulationTestVoltageV} V` : ''}`}
        </Fact>
      </dl>
      {check.irradianceMethod || check.moduleTempMethod ? (
        <p className="text-sm text-ink-muted">
          {[check.irradianceMethod ? `Irradiance: ${irradianceMethodLabels[check.irradianceMethod]}` : null, check.moduleTempMethod ? `Temperature: ${moduleTempMethodLabels[check.moduleTempMethod]}` : null]
            .filter(Boolean)
            .join(' · ')}
        </p>
      ) : null}
      {check.isCalibrationOverdue ? (
        <p className="flex gap-2 text-base font-semibold text-attention">
          <Icon name="alert" className="mt-0.5 size-5" /> Taken with an instrument past calibration.
        </p>
      ) : null}
      {check.notes ? <p className="rounded-control bg-sunken p-2 text-base">“{check.notes}”</p> : null}

      <div>
        <h4 className="font-semibold">Peer strings on the same input</h4>
        {check.peers.length === 0 ? (
          <p className="text-sm text-ink-muted">No identical string on this inverter input was measured within 15 minutes, so the datasheet was the reference.</p>
        ) : (
          <table className="mt-1 w-full text-base">
            <caption className="sr-only">Peer strings measured within 15 minutes</caption>
            <thead>
              <tr className="text-left text-sm text-ink-muted">
                <th scope="col" className="py-1 font-semibold">String</th>
                <th scope="col" className="py-1 text-right font-semibold">Voc</th>
                <th scope="col" className="py-1 text-right font-semibold">Isc</th>
                <th scope="col" className="py-1 text-right font-semibold">At</th>
              </tr>
            </thead>
            <tbody>
              {check.peers.map((p) => (
                <tr key={p.stringLabel + p.takenAt} className="border-t border-line">
                  <th scope="row" className="py-1 text-left font-semibold">{p.stringLabel}</th>
                  <td className="readings py-1 text-right">{formatNumber(p.vocV, 1)} V</td>
                  <td className="readings py-1 text-right">{p.iscA === null ? '—' : `${formatNumber(p.iscA, 2)} A`}</td>
                  <td className="readings py-1 text-right">{formatTakenAt(p.takenAt)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
      </div>
      {actions ? <div className="flex flex-col gap-2 sm:flex-row sm:flex-wrap">{actions}</div> : null}
    </section>
  );
}
