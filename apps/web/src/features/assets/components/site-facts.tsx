import type { Site } from '@stringfield/shared';
import { formatQuantity } from '../lib/format';

/** The design conditions every sizing verdict of the site rests on. */
export function SiteFacts({ site }: { site: Site }) {
  const facts: [string, string][] = [
    ['Time zone', site.timeZone.replace(/_/g, ' ')],
    ['Ambient range', `${formatQuantity(site.lowestAmbientC, '°C', 0)} to ${formatQuantity(site.highestAmbientC, '°C', 0)}`],
    ['Design irradiance', formatQuantity(site.designIrradianceWm2, 'W/m²')],
    ['Inverters', String(site.inverterCount)],
    ['Strings', String(site.stringCount)],
    ['Owner contact', site.ownerContactEmail],
  ];
  return (
    <dl className="grid grid-cols-2 gap-3 sm:grid-cols-3">
      {facts.map(([label, value]) => (
        <div key={label} className="min-w-0 rounded-card border border-line bg-surface px-4 py-3 shadow-card">
          <dt className="text-sm text-ink-muted">{label}</dt>
          <dd className="readings text-lg font-semibold [overflow-wrap:anywhere]">{value}</dd>
        </div>
      ))}
    </dl>
  );
}
