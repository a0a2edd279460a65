import type { PvStringDetail } from '@stringfield/shared';
import type { ReactNode } from 'react';
import { Card } from '@/components/ui/card';
import { formatNumber, formatPower, formatQuantity } from '../lib/format';
import { stringWindow } from '../lib/inverter-window';

function Facts({ title, rows, footnote }: { title: string; rows: [string, ReactNode][]; footnote?: ReactNode }) {
  return (
    <Card className="p-4 sm:p-5">
      <h2 className="mb-3 text-lg font-semibold">{title}</h2>
      <dl className="divide-y divide-line">
        {rows.map(([label, value]) => (
          <div key={label} className="flex items-baseline justify-between gap-4 py-1.5">
            <dt className="text-ink-muted">{label}</dt>
            <dd className="readings text-right font-semibold">{value}</dd>
          </div>
        ))}
      </dl>
      {footnote ? <p className="mt-3 text-sm text-ink-muted">{footnote}</p> : null}
    </Card>
  );
}

const pct = (v: number) => `${v > 0 ? '+' : ''}${formatNumber(v, 3)} %/°C`;

/** The module datasheet and the inverter input this string works into. */
export function StringFacts({ string: s }: { string: PvStringDetail }) {
  const m = s.module;
  const inv = s.inverter.model;
  const share = stringWindow(inv, s.stringsInParallel);
  return (
    <div className="grid gap-4 lg:grid-cols-3">
      <Facts
        title="String"
        rows={[
          ['Modules in series', s.modulesInSeries],
          ['Strings on the input', s.stringsInParallel],
          ['Inverter', `${s.inverter.tag} · MPPT ${s.mpptInput}`],
          ['Inverter serial', s.inverter.serial || '–'],
          ['Combiner', s.combinerTag ? `${s.combinerTag}${s.combinerPosition ? ` · pos ${s.combinerPosition}` : ''}` : 'Direct'],
          ['Commissioned', s.commissionedOn ?? '–'],
        ]}
        footnote={s.notes || undefined}
      />
      <Facts
        title={`Module ${m.model}`}
        rows={[
          ['Maker', m.maker],
          ['Pmax', formatQuantity(m.pmaxW, 'W', 0)],
          ['Voc · Isc', `${formatQuantity(m.vocV, 'V', 2)} · ${formatQuantity(m.iscA, 'A')}`],
          ['Vmp · Imp', `${formatQuantity(m.vmpV, 'V', 2)} · ${formatQuantity(m.impA, 'A')}`],
          ['α Isc', pct(m.alphaIscPctPerC)],
          ['β Voc', pct(m.betaVocPctPerC)],
          ['γ Pmax', pct(m.gammaPmaxPctPerC)],
          ['Cells · bypass diodes', `${m.cellsInSeries} · ${m.bypassDiodes}`],
          ['NOCT', m.noctC === null ? '–' : formatQuantity(m.noctC, '°C', 0)],
        ]}
      />
      <Facts
        title={`Inverter input (${inv.model})`}
        rows={[
          ['MPPT window', `${formatNumber(inv.mpptMinV)}–${formatQuantity(inv.mpptMaxV, 'V', 0)}`],
          ['Max DC voltage', formatQuantity(inv.maxDcV, 'V', 0)],
          ['Start voltage', formatQuantity(inv.startV, 'V', 0)],
          ['Max input current', formatQuantity(inv.maxInputA, 'A', 1)],
          ['Max input Isc', formatQuantity(inv.maxInputIscA, 'A', 1)],
          ['DC power per input', formatPower(inv.maxDcW / inv.mpptInputs)],
          ['MPPT inputs', inv.mpptInputs],
        ]}
        footnote={
          s.stringsInParallel > 1
            ? `Shared by ${s.stringsInParallel} strings: this string's share is ${formatQuantity(share.maxCurrentA, 'A')} and ${formatPower(share.maxPowerW)}.`
            : undefined
        }
      />
    </div>
  );
}
