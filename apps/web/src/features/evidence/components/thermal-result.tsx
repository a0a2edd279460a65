import { thermalPatternLabels, thermalPatterns, type Photo } from '@stringfield/shared';
import { Icon } from '@/components/ui/icon';
import { cn } from '@/lib/cn';
import { formatNumber } from '../lib/format';
import { classView } from '../lib/thermal';

const toneClasses = {
  pass: 'border-pass/40 bg-pass-soft',
  attention: 'border-attention/40 bg-attention-soft',
  fail: 'border-fail/40 bg-fail-soft',
  neutral: 'border-line bg-sunken',
  brand: 'border-brand/30 bg-brand-soft',
} as const;
const iconClasses = { pass: 'text-pass', attention: 'text-attention', fail: 'text-fail', neutral: 'text-ink', brand: 'text-brand' } as const;

function patternLabel(pattern: string): string {
  return (thermalPatterns as readonly string[]).includes(pattern) ? thermalPatternLabels[pattern as (typeof thermalPatterns)[number]] : pattern;
}

/** The recorded finding of a thermal image: ΔT, the class with its reason, or "conditions too poor". */
export function ThermalResult({ thermal }: { thermal: NonNullable<Photo['thermal']> }) {
  const view = classView(thermal.classOfAbnormality, thermal.isConditionsTooPoor);
  return (
    <div className={cn('flex flex-col gap-2 rounded-control border-2 p-3', toneClasses[view.tone])}>
      <p className="flex items-center gap-2 text-lg font-bold">
        <Icon name={view.icon} className={cn('size-6', iconClasses[view.tone])} />
        <span>
          {view.title}
          <span className="font-semibold"> — {view.summary}</span>
        </span>
      </p>
      <dl className="readings grid grid-cols-2 gap-x-4 gap-y-1 text-base">
        <div>
          <dt className="text-sm text-ink-muted">ΔT</dt>
          <dd className="font-semibold">{formatNumber(thermal.deltaTC)} K</dd>
        </div>
        <div>
          <dt className="text-sm text-ink-muted">Hottest / reference</dt>
          <dd>
            {formatNumber(thermal.hottestC)} / {formatNumber(thermal.referenceC)} °C
          </dd>
        </div>
        <div>
          <dt className="text-sm text-ink-muted">Irradiance</dt>
          <dd>{thermal.irradianceWm2.toFixed(0)} W/m²</dd>
        </div>
        <div>
          <dt className="text-sm text-ink-muted">Pattern</dt>
          <dd>
            {patternLabel(thermal.pattern)}
            {thermal.modulePosition ? `, module ${thermal.modulePosition}` : ''}
          </dd>
        </div>
      </dl>
      <p className="text-base">{thermal.reason}</p>
    </div>
  );
}
