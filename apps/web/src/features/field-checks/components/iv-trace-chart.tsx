import type { IvPoint } from '@stringfield/pv';
import { useMemo } from 'react';
import { CartesianGrid, Legend, Line, LineChart, ReferenceDot, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import { formatNumber } from '../lib/format';

/* Colours from the design tokens, read at run time so the chart follows the theme. */
function useColours() {
  return useMemo(() => {
    const style = getComputedStyle(document.documentElement);
    const read = (name: string, fallback: string) => style.getPropertyValue(name).trim() || fallback;
    return {
      measured: read('--color-copper', '#9a410d'),
      healthy: read('--color-ink-muted', '#3d4a46'),
      stc: read('--color-brand', '#0e4b4f'),
      grid: read('--color-line', '#d6d0c2'),
      ink: read('--color-ink', '#13201d'),
      fail: read('--color-fail', '#b0231c'),
    };
  }, []);
}

const tick = { fontSize: 14 };

/**
 * The measured I-V curve over the healthy string modelled at the same irradiance and temperature,
 * with the curve translated to STC. Hidden from assistive technology: the panel states the same facts
 * in text. Loaded on demand, so the field page stays light.
 */
export default function IvTraceChart({
  measured,
  healthy,
  stc,
  steps,
}: {
  measured: readonly IvPoint[];
  healthy: readonly IvPoint[] | null;
  stc: readonly IvPoint[];
  steps: ReadonlyArray<{ atV: number; atA: number }>;
}) {
  const colours = useColours();
  const xMax = Math.ceil((Math.max(...[...measured, ...(healthy ?? []), ...stc].map((p) => p.voltageV), 10) * 1.03) / 50) * 50;
  return (
    // Hidden from assistive technology (the figures are given in words beside it), so the charts
    // have Recharts' keyboard layer off: nothing in here may take focus.
    <div aria-hidden="true" className="h-72 w-full sm:h-96">
      <ResponsiveContainer width="100%" height="100%">
        <LineChart accessibilityLayer={false} margin={{ top: 8, right: 12, bottom: 24, left: 0 }}>
          <CartesianGrid stroke={colours.grid} strokeDasharray="3 3" />
          <XAxis
            type="number"
            dataKey="voltageV"
            domain={[0, xMax]}
            tick={tick}
            stroke={colours.ink}
            label={{ value: 'Voltage (V)', position: 'insideBottom', offset: -14, fill: colours.ink, fontSize: 14 }}
          />
          <YAxis type="number" dataKey="currentA" tick={tick} stroke={colours.ink} width={44} label={{ value: 'A', position: 'insideTopLeft', fill: colours.ink, fontSize: 14 }} />
          <Tooltip
            formatter={(value) => `${formatNumber(Number(value), 2)} A`}
            labelFormatter={(label) => `${formatNumber(Number(label), 1)} V`}
            contentStyle={{ fontSize: 14 }}
          />
          <Legend verticalAlign="top" height={44} wrapperStyle={{ fontSize: 14 }} />
          {healthy ? <Line name="Healthy string (model)" data={[...healthy]} dataKey="currentA" stroke={colours.healthy} strokeWidth={2} strokeDasharray="6 4" dot={false} isAnimationActive={false} /> : null}
          <Line name="Translated to STC" data={[...stc]} dataKey="currentA" stroke={colours.stc} strokeWidth={2} dot={false} isAnimationActive={false} />
          <Line name="Measured" data={[...measured]} dataKey="currentA" stroke={colours.measured} strokeWidth={3} dot={false} isAnimationActive={false} />
          {steps.map((s) => (
            <ReferenceDot key={`${s.atV}-${s.atA}`} x={s.atV} y={s.atA} r={6} fill={colours.fail} stroke="white" strokeWidth={2} />
          ))}
        </LineChart>
      </ResponsiveContainer>
    </div>
  );
}
