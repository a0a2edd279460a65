import { useMemo, useSyncExternalStore } from 'react';
import { Bar, BarChart, CartesianGrid, Legend, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import { formatNumber } from '../lib/format';
import type { MeanTimeRow, OpenByStatusRow } from '../lib/metrics-data';

/* recharts is heavy: this module is only ever reached through React.lazy from the metrics page.
   Each chart sits in a role="img" with its table one press away, so Recharts' keyboard layer is off:
   a focusable svg inside an image would be a stop with nothing to say. */

function useColours() {
  return useMemo(() => {
    const style = getComputedStyle(document.documentElement);
    const read = (name: string, fallback: string) => style.getPropertyValue(name).trim() || fallback;
    return {
      brand: read('--color-brand', '#0e4b4f'),
      copper: read('--color-copper', '#9a410d'),
      muted: read('--color-ink-muted', '#3d4a46'),
      attention: read('--color-attention', '#8a5200'),
      grid: read('--color-line', '#d6d0c2'),
      ink: read('--color-ink', '#13201d'),
    };
  }, []);
}

const wideQuery = '(min-width: 640px)';
const subscribeWide = (onChange: () => void) => {
  const media = window.matchMedia(wideQuery);
  media.addEventListener('change', onChange);
  return () => media.removeEventListener('change', onChange);
};

/** Category labels take 150 px beside the bars on a desktop, 104 px on a phone. */
function useCategoryAxis() {
  const isWide = useSyncExternalStore(subscribeWide, () => window.matchMedia(wideQuery).matches);
  return isWide ? { width: 150, tick: { fontSize: 13 } } : { width: 104, tick: { fontSize: 12 } };
}

const tick = { fontSize: 14 };
const days = (v: number) => `${formatNumber(v, v < 10 ? 1 : 0)} d`;
const tooltipStyle = { borderRadius: 8, border: '1px solid #8c8472', fontSize: 14 };

/* Three series need more than colour: solid, stripes and dots, drawn as SVG patterns. */
function SeriesPatterns({ colours }: { colours: ReturnType<typeof useColours> }) {
  return (
    <defs>
      <pattern id="sf-stripes" width="6" height="6" patternUnits="userSpaceOnUse" patternTransform="rotate(45)">
        <rect width="6" height="6" fill={colours.copper} />
        <rect width="2.5" height="6" fill="#ffffff" fillOpacity="0.45" />
      </pattern>
      <pattern id="sf-dots" width="6" height="6" patternUnits="userSpaceOnUse">
        <rect width="6" height="6" fill={colours.muted} />
        <circle cx="3" cy="3" r="1.4" fill="#ffffff" fillOpacity="0.6" />
      </pattern>
    </defs>
  );
}

export function OpenByStatusChart({ rows }: { rows: OpenByStatusRow[] }) {
  const c = useColours();
  const data = rows.map((r) => ({ ...r, averageAgeDays: Math.round((r.averageAgeHours / 24) * 10) / 10 }));
  return (
    <ResponsiveContainer width="100%" height="100%">
      <BarChart accessibilityLayer={false} data={data} margin={{ top: 8, right: 8, bottom: 8, left: 0 }} barGap={2}>
        <SeriesPatterns colours={c} />
        <CartesianGrid stroke={c.grid} vertical={false} />
        <XAxis dataKey="label" tick={tick} interval={0} angle={-20} textAnchor="end" height={56} />
        <YAxis yAxisId="count" allowDecimals={false} tick={tick} width={36} />
        <YAxis yAxisId="age" orientation="right" tick={tick} width={48} tickFormatter={days} />
        <Tooltip contentStyle={tooltipStyle} formatter={(value, name) => [name === 'Tickets' ? formatNumber(Number(value)) : `${formatNumber(Number(value), 1)} days`, name]} />
        <Legend wrapperStyle={{ fontSize: 14 }} />
        <Bar yAxisId="count" dataKey="count" name="Tickets" fill={c.brand} radius={[3, 3, 0, 0]} />
        <Bar yAxisId="age" dataKey="averageAgeDays" name="Average age (days)" fill="url(#sf-stripes)" stroke={c.copper} radius={[3, 3, 0, 0]} />
      </BarChart>
    </ResponsiveContainer>
  );
}

export function MeanTimesChart({ rows }: { rows: MeanTimeRow[] }) {
  const c = useColours();
  const axis = useCategoryAxis();
  return (
    <ResponsiveContainer width="100%" height="100%">
      <BarChart accessibilityLayer={false} data={rows} layout="vertical" margin={{ top: 4, right: 12, bottom: 4, left: 4 }} barGap={1} barCategoryGap="18%">
        <SeriesPatterns colours={c} />
        <CartesianGrid stroke={c.grid} horizontal={false} />
        <XAxis type="number" tick={tick} unit=" h" />
        <YAxis type="category" dataKey="label" tick={axis.tick} width={axis.width} interval={0} />
        <Tooltip contentStyle={tooltipStyle} formatter={(value, name) => [value === null || value === undefined ? 'not reached' : `${formatNumber(Number(value), 1)} h`, name]} />
        <Legend wrapperStyle={{ fontSize: 14 }} />
        <Bar dataKey="toDispatchHours" name="To dispatch" fill={c.brand} />
        <Bar dataKey="toRepairHours" name="To repair" fill="url(#sf-stripes)" stroke={c.copper} />
        <Bar dataKey="toSignOffHours" name="To sign-off" fill="url(#sf-dots)" stroke={c.muted} />
      </BarChart>
    </ResponsiveContainer>
  );
}

/** One series of counts as horizontal bars: top fault categories, repeat faults. */
export function CountBarChart({ rows, name }: { rows: { label: string; count: number }[]; name: string }) {
  const c = useColours();
  const axis = useCategoryAxis();
  return (
    <ResponsiveContainer width="100%" height="100%">
      <BarChart accessibilityLayer={false} data={rows} layout="vertical" margin={{ top: 4, right: 16, bottom: 4, left: 4 }} barCategoryGap="22%">
        <CartesianGrid stroke={c.grid} horizontal={false} />
        <XAxis type="number" allowDecimals={false} tick={tick} />
        <YAxis type="category" dataKey="label" tick={axis.tick} width={axis.width} interval={0} />
        <Tooltip contentStyle={tooltipStyle} formatter={(value) => [formatNumber(Number(value)), name]} />
        <Bar dataKey="count" name={name} fill={c.brand} radius={[0, 3, 3, 0]} label={{ position: 'right', fontSize: 13, fill: c.ink }} />
      </BarChart>
    </ResponsiveContainer>
  );
}
