import { expectedString, type CurvePoints, type ModuleSpec } from '@stringfield/pv';
import { Alert } from '@/components/ui/alert';
import type { Conditions } from '../lib/conditions';
import { formatNumber, formatQuantity } from '../lib/format';

const rows: { key: keyof CurvePoints; label: string; unit: string }[] = [
  { key: 'vocV', label: 'Open-circuit voltage Voc', unit: 'V' },
  { key: 'iscA', label: 'Short-circuit current Isc', unit: 'A' },
  { key: 'vmpV', label: 'Voltage at maximum power Vmp', unit: 'V' },
  { key: 'impA', label: 'Current at maximum power Imp', unit: 'A' },
  { key: 'pmpW', label: 'Maximum power Pmp', unit: 'W' },
];

function safeExpected(module: ModuleSpec, modulesInSeries: number, c: Conditions): CurvePoints | null {
  try {
    return expectedString({ module, modulesInSeries, ...c });
  } catch {
    return null;
  }
}

/** What a healthy string should read at STC and at the chosen condition, computed in the browser. */
export function ExpectedValues({ module, modulesInSeries, conditions }: { module: ModuleSpec; modulesInSeries: number; conditions: Conditions | null }) {
  const stc = safeExpected(module, modulesInSeries, { irradianceWm2: 1000, moduleTempC: 25 });
  const chosen = conditions ? safeExpected(module, modulesInSeries, conditions) : null;
  if (!stc) return <Alert tone="fail">The datasheet values do not allow a model of this string. Check the module datasheet.</Alert>;
  const chosenLabel = conditions
    ? `${formatNumber(conditions.irradianceWm2)} W/m², ${formatNumber(conditions.moduleTempC, 1)} °C`
    : 'Chosen condition';
  return (
    <div className="overflow-x-auto rounded-card border border-line bg-surface shadow-card">
      <table className="w-full min-w-[20rem] border-collapse text-left">
        <caption className="sr-only">Expected values of a healthy string, at STC and at {chosenLabel}</caption>
        <thead className="bg-sunken">
          <tr>
            <th scope="col" className="sticky left-0 bg-sunken px-4 py-2 text-sm font-semibold text-ink-muted">
              Value
            </th>
            <th scope="col" className="px-4 py-2 text-right text-sm font-semibold text-ink-muted">
              STC <span className="block font-normal">1000 W/m², 25 °C</span>
            </th>
            <th scope="col" className="px-4 py-2 text-right text-sm font-semibold text-ink-muted">
              Chosen <span className="block font-normal">{chosenLabel}</span>
            </th>
          </tr>
        </thead>
        <tbody aria-live="polite">
          {rows.map((row) => (
            <tr key={row.key} className="border-t border-line">
              <th scope="row" className="sticky left-0 bg-surface px-4 py-2 font-medium">
                {row.label}
              </th>
              <td className="readings px-4 py-2 text-right whitespace-nowrap">{formatQuantity(stc[row.key], row.unit)}</td>
              <td className="readings px-4 py-2 text-right font-semibold whitespace-nowrap">{chosen ? formatQuantity(chosen[row.key], row.unit) : '–'}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
