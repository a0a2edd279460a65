import type { PvStringDetail } from '@stringfield/shared';
import { useMemo, useState } from 'react';
import { Card } from '@/components/ui/card';
import { parseConditions, type ConditionsText } from '../lib/conditions';
import { toModuleSpec } from '../lib/module-spec';
import { ConditionsFields, type ConditionPreset } from './conditions-fields';
import { ExpectedValues } from './expected-values';
import { WhatIfPanel } from './what-if-panel';

/** Expected values and the what-if curves of one string, at one operating condition picked here. */
export function StringWorkbench({ string: s }: { string: PvStringDetail }) {
  const module = useMemo(() => toModuleSpec(s.module), [s.module]);
  const [text, setText] = useState<ConditionsText>({ irradianceWm2: '1000', moduleTempC: '25' });
  const { value: conditions, errors } = parseConditions(text);

  const presets: ConditionPreset[] = [
    { label: 'STC', value: { irradianceWm2: '1000', moduleTempC: '25' } },
    { label: `Cold morning (${s.site.lowestAmbientC} °C)`, value: { irradianceWm2: '1000', moduleTempC: String(Math.max(-40, s.site.lowestAmbientC)) } },
    // A ground-mounted module runs about 30 K above ambient in full sun (NOCT-based rule of thumb).
    { label: `Hot day (${s.site.highestAmbientC + 30} °C module)`, value: { irradianceWm2: '1000', moduleTempC: String(Math.min(90, s.site.highestAmbientC + 30)) } },
    { label: 'Hazy (600 W/m²)', value: { irradianceWm2: '600', moduleTempC: '35' } },
  ];

  return (
    <>
      <section aria-labelledby="expected-heading" className="mb-8">
        <h2 id="expected-heading" className="mb-3 text-xl font-semibold">
          Expected values of a healthy string
        </h2>
        <div className="grid gap-4 lg:grid-cols-[minmax(0,22rem)_minmax(0,1fr)]">
          <Card className="p-4 sm:p-5">
            <ConditionsFields value={text} errors={errors} presets={presets} onChange={setText} />
          </Card>
          <ExpectedValues module={module} modulesInSeries={s.modulesInSeries} conditions={conditions} />
        </div>
      </section>

      <section aria-labelledby="whatif-heading" className="mb-8">
        <h2 id="whatif-heading" className="mb-1 text-xl font-semibold">
          What if: shade and bypassed substrings
        </h2>
        <p className="mb-3 max-w-prose text-ink-muted">At the operating condition above. Change the shade to see where the inverter finds the maximum-power point.</p>
        <WhatIfPanel module={module} modulesInSeries={s.modulesInSeries} stringsInParallel={s.stringsInParallel} inverter={s.inverter.model} conditions={conditions} />
      </section>
    </>
  );
}
