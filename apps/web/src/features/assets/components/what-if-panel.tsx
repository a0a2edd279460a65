import { simulateString, type ModuleSpec, type SimulatedString } from '@stringfield/pv';
import { lazy, Suspense, useMemo, useState } from 'react';
import { Alert } from '@/components/ui/alert';
import { Card } from '@/components/ui/card';
import { FormField, Input, Select } from '@/components/ui/form-field';
import { LoadingRegion, Skeleton } from '@/components/ui/skeleton';
import type { Conditions } from '../lib/conditions';
import { curveTable } from '../lib/curve';
import { formatNumber, formatPower, formatQuantity } from '../lib/format';
import { judgeMpp, stringWindow, type InverterInputSpec, type MppVerdict, type StringWindow } from '../lib/inverter-window';
import { parseDecimal } from '../lib/parse-decimal';
import { buildShading, type ShadeLayout, type ShadeScenario } from '../lib/shading';
import { useDebouncedValue } from '../lib/use-debounced-value';
import { QuantityInput } from './quantity-input';

// recharts is large: load it only when a curve is drawn, never with the technician's first page.
const IvChart = lazy(() => import('./iv-chart').then((m) => ({ default: m.IvChart })));

type ScenarioText = { shadedModule: string; shadedCells: string; shadePercent: string; layout: ShadeLayout; bypassedSubstrings: string };

function wholeNumber(text: string, min: number, max: number, what: string): { value: number; error?: string } {
  const n = parseDecimal(text);
  if (n === undefined || !Number.isInteger(n)) return { value: min, error: `Enter ${what} as a whole number` };
  if (n < min || n > max) return { value: Math.min(max, Math.max(min, n)), error: `Use ${min} to ${max}` };
  return { value: n };
}

function readScenario(text: ScenarioText, module: ModuleSpec, modulesInSeries: number) {
  const shadedModule = wholeNumber(text.shadedModule, 1, modulesInSeries, 'the module number');
  const shadedCells = wholeNumber(text.shadedCells, 0, module.cellsInSeries, 'the number of cells');
  const percent = parseDecimal(text.shadePercent);
  const shadeError = percent === undefined || Number.isNaN(percent) ? 'Enter the shade in %' : percent < 0 || percent > 100 ? 'Use 0 to 100 %' : undefined;
  const bypassed = wholeNumber(text.bypassedSubstrings, 0, modulesInSeries * module.bypassDiodes, 'the number of substrings');
  const errors = { shadedModule: shadedModule.error, shadedCells: shadedCells.error, shadePercent: shadeError, bypassedSubstrings: bypassed.error };
  const scenario: ShadeScenario = {
    shadedModule: shadedModule.value,
    shadedCells: shadedCells.value,
    shadeFraction: shadeError ? 0 : (percent ?? 0) / 100,
    layout: text.layout,
    bypassedSubstrings: bypassed.value,
  };
  return { scenario, errors, isValid: Object.values(errors).every((e) => e === undefined) };
}

type Result = { healthy: SimulatedString; modelled: SimulatedString } | { error: string };

function simulate(module: ModuleSpec, modulesInSeries: number, conditions: Conditions, scenario: ShadeScenario): Result {
  try {
    const base = { module, modulesInSeries, ...conditions, points: 240 };
    return { healthy: simulateString(base), modelled: simulateString({ ...base, shading: buildShading(scenario, module, modulesInSeries) }) };
  } catch (error) {
    return { error: error instanceof Error ? error.message : 'The model could not be computed for these values.' };
  }
}

function positionText(verdict: MppVerdict, w: StringWindow): string {
  const range = `${formatNumber(w.mpptMinV)}–${formatQuantity(w.mpptMaxV, 'V', 0)}`;
  if (verdict.position === 'below-mppt-min') return `The maximum-power point falls below the MPPT window (${range}): the inverter cannot track it and holds the input at its minimum, or stops.`;
  if (verdict.position === 'above-mppt-max') return `The maximum-power point lies above the MPPT window (${range}): the inverter tracks off it, at the window's top.`;
  return `The maximum-power point stays inside the MPPT window (${range}).`;
}

/**
 * What if part of the string is shaded, or substrings are lost? Models the string cell by cell
 * (`simulateString`) and sets the curve against the healthy one and the inverter input.
 */
export function WhatIfPanel({
  module,
  modulesInSeries,
  stringsInParallel,
  inverter,
  conditions,
}: {
  module: ModuleSpec;
  modulesInSeries: number;
  stringsInParallel: number;
  inverter: InverterInputSpec;
  conditions: Conditions | null;
}) {
  const [text, setText] = useState<ScenarioText>({ shadedModule: '1', shadedCells: '2', shadePercent: '75', layout: 'along', bypassedSubstrings: '0' });
  const { scenario, errors, isValid } = readScenario(text, module, modulesInSeries);
  // Debounce a string key, not an object: a fresh object every render would never settle.
  const key = isValid && conditions ? JSON.stringify({ scenario, conditions }) : '';
  const settledKey = useDebouncedValue(key, 200);
  const result = useMemo(() => {
    if (!settledKey) return null;
    const settled = JSON.parse(settledKey) as { scenario: ShadeScenario; conditions: Conditions };
    return simulate(module, modulesInSeries, settled.conditions, settled.scenario);
  }, [settledKey, module, modulesInSeries]);
  const window = stringWindow(inverter, stringsInParallel);
  const cellsPerSubstring = module.cellsInSeries / module.bypassDiodes;
  const set = (changes: Partial<ScenarioText>) => setText((t) => ({ ...t, ...changes }));

  return (
    <Card className="p-4 sm:p-5">
      <div className="grid gap-6 lg:grid-cols-[minmax(0,20rem)_minmax(0,1fr)]">
        <fieldset className="flex flex-col gap-4">
          <legend className="mb-1 font-semibold">Shade and bypass</legend>
          <FormField label="Shaded module" hint={`1 to ${modulesInSeries}, counted from the + end.`} error={errors.shadedModule}>
            <Input type="text" inputMode="numeric" className="readings" value={text.shadedModule} onChange={(e) => set({ shadedModule: e.target.value })} />
          </FormField>
          <div className="grid grid-cols-2 gap-3">
            <FormField label="Cells shaded" hint={`0 to ${module.cellsInSeries}`} error={errors.shadedCells}>
              <Input type="text" inputMode="numeric" className="readings" value={text.shadedCells} onChange={(e) => set({ shadedCells: e.target.value })} />
            </FormField>
            <FormField label="Shade" hint="Light blocked" error={errors.shadePercent}>
              <QuantityInput unit="%" value={text.shadePercent} onChange={(e) => set({ shadePercent: e.target.value })} />
            </FormField>
          </div>
          <FormField label="Shaded cells lie" hint={`${cellsPerSubstring} cells per substring, ${module.bypassDiodes} substrings per module.`}>
            <Select value={text.layout} onChange={(e) => set({ layout: e.target.value as ShadeLayout })}>
              <option value="along">One substring (leaf, dropping)</option>
              <option value="across">Across substrings (pole, row shadow)</option>
            </Select>
          </FormField>
          <FormField
            label="Substrings bypassed"
            hint={`Whole substrings out (dead, or a shorted bypass diode), from module 1 on. 0 to ${modulesInSeries * module.bypassDiodes}.`}
            error={errors.bypassedSubstrings}
          >
            <Input type="text" inputMode="numeric" className="readings" value={text.bypassedSubstrings} onChange={(e) => set({ bypassedSubstrings: e.target.value })} />
          </FormField>
        </fieldset>

        <div className="min-w-0">
          <WhatIfVerdict result={result} window={window} isStale={settledKey !== key} hasConditions={conditions !== null} />
        </div>
      </div>
      {result && !('error' in result) ? <WhatIfCurves result={result} window={window} isStale={settledKey !== key} /> : null}
    </Card>
  );
}

function WhatIfVerdict({ result, window, isStale, hasConditions }: { result: Result | null; window: StringWindow; isStale: boolean; hasConditions: boolean }) {
  if (!hasConditions) return <Alert tone="info">Enter an irradiance and module temperature above to model the curves.</Alert>;
  if (!result) return <Alert tone="info">Correct the fields on the left to model the curves.</Alert>;
  if ('error' in result) return <Alert tone="fail" title="This case could not be modelled">{result.error}</Alert>;

  const { healthy, modelled } = result;
  const verdict = judgeMpp(modelled, window);
  const lossPct = healthy.pmpW > 0 ? (1 - modelled.pmpW / healthy.pmpW) * 100 : 0;
  const bypassed = modelled.bypassedSubstringsAtMpp;
  const tone = verdict.isVocOverMaxDc ? 'fail' : verdict.isInsideWindow ? 'pass' : 'attention';

  return (
    <div className={isStale ? 'opacity-70 transition-opacity' : 'transition-opacity'}>
      <div aria-live="polite" aria-atomic="true">
        <Alert tone={tone} title={verdict.isInsideWindow ? 'MPP inside the inverter window' : verdict.position === 'inside' ? 'MPP inside the MPPT window, beyond a limit' : 'MPP outside the MPPT window'}>
          <p>
            What-if MPP: <span className="readings font-semibold">{formatQuantity(modelled.vmpV, 'V')}</span>,{' '}
            <span className="readings font-semibold">{formatQuantity(modelled.impA, 'A')}</span>,{' '}
            <span className="readings font-semibold">{formatPower(modelled.pmpW)}</span>
            {lossPct > 0.05 ? ` (${formatNumber(lossPct, 1)} % less than healthy)` : ''}. Healthy: {formatQuantity(healthy.vmpV, 'V')}, {formatPower(healthy.pmpW)}.
          </p>
          <p className="mt-1">{positionText(verdict, window)}</p>
          <p className="mt-1">
            {bypassed === 0
              ? 'No bypass diode conducts at the MPP.'
              : bypassed === 1
                ? '1 substring is bypassed at the MPP (its bypass diode conducts).'
                : `${bypassed} substrings are bypassed at the MPP (their bypass diodes conduct).`}
          </p>
          {verdict.isOverPower ? (
            <p className="mt-1">Above this string&apos;s share of the input power ({formatPower(window.maxPowerW)}): expect clipping on clear days.</p>
          ) : null}
          {verdict.isOverCurrent ? <p className="mt-1">Above this string&apos;s share of the input current ({formatQuantity(window.maxCurrentA, 'A')}).</p> : null}
          {verdict.isVocOverMaxDc ? (
            <p className="mt-1 font-semibold">
              Open-circuit voltage {formatQuantity(modelled.vocV, 'V')} is above the inverter&apos;s {formatQuantity(window.maxDcV, 'V', 0)} maximum DC voltage at this temperature.
            </p>
          ) : null}
        </Alert>
      </div>
    </div>
  );
}

function WhatIfCurves({ result: { healthy, modelled }, window, isStale }: { result: { healthy: SimulatedString; modelled: SimulatedString }; window: StringWindow; isStale: boolean }) {
  const table = curveTable(healthy.curve, modelled.curve);
  return (
    <div className={isStale ? 'mt-6 opacity-70 transition-opacity' : 'mt-6 transition-opacity'}>
      <figure>
        <Suspense
          fallback={
            <LoadingRegion label="Loading the chart">
              <Skeleton className="h-[34rem] w-full rounded-card" />
            </LoadingRegion>
          }
        >
          <IvChart healthy={healthy.curve} modelled={modelled.curve} healthyMpp={healthy} modelledMpp={modelled} window={window} />
        </Suspense>
        <figcaption className="mt-2 text-sm text-ink-muted">
          Modelled curves: what-if (solid copper) against a healthy string (dashed), Voc {formatQuantity(modelled.vocV, 'V')} vs {formatQuantity(healthy.vocV, 'V')}, Isc{' '}
          {formatQuantity(modelled.iscA, 'A')} vs {formatQuantity(healthy.iscA, 'A')}. The shaded band is the MPPT window, the red line the maximum DC voltage, the dotted red line
          the power limit {window.stringsInParallel > 1 ? `(this string's share of ${window.stringsInParallel} on the input)` : ''}.
        </figcaption>
      </figure>

      <details className="mt-3 rounded-control border border-line bg-surface">
        <summary className="flex min-h-touch cursor-pointer items-center px-3 font-semibold">Curve values as a table</summary>
        <div className="overflow-x-auto">
          <table className="w-full min-w-[24rem] border-collapse text-right">
            <caption className="sr-only">Current and power of the healthy and the what-if string at the same voltages</caption>
            <thead className="bg-sunken text-sm text-ink-muted">
              <tr>
                <th scope="col" className="sticky left-0 bg-sunken px-3 py-2">Voltage</th>
                <th scope="col" className="px-3 py-2">Healthy current</th>
                <th scope="col" className="px-3 py-2">What-if current</th>
                <th scope="col" className="px-3 py-2">Healthy power</th>
                <th scope="col" className="px-3 py-2">What-if power</th>
              </tr>
            </thead>
            <tbody className="readings">
              {table.map((row) => (
                <tr key={row.voltageV} className="border-t border-line">
                  <th scope="row" className="sticky left-0 bg-surface px-3 py-1.5 font-medium">{formatQuantity(row.voltageV, 'V', 0)}</th>
                  <td className="px-3 py-1.5">{formatQuantity(row.healthyA, 'A')}</td>
                  <td className="px-3 py-1.5">{formatQuantity(row.modelledA, 'A')}</td>
                  <td className="px-3 py-1.5">{formatPower(row.healthyA * row.voltageV)}</td>
                  <td className="px-3 py-1.5">{formatPower(row.modelledA * row.voltageV)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      </details>
    </div>
  );
}
