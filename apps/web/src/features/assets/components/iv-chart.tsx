import type { IvPoint } from '@stringfield/pv';
import { useMemo } from 'react';
import {
  CartesianGrid,
  Legend,
  Line,
  LineChart,
  ReferenceArea,
  ReferenceDot,
  ReferenceLine,
  ResponsiveContainer,
  Tooltip,
  XAxis,
  YAxis,
} from 'recharts';
import { formatNumber } from '../lib/format';
import { powerLimitCurve, type StringWindow } from '../lib/inverter-window';

type Mpp = { vmpV: number; impA: number; pmpW: number };

/* The theme's colours, read from the CSS custom properties so the chart follows the tokens. */
function useThemeColours() {
  return useMemo(() => {
    const style = getComputedStyle(document.documentElement);
    const read = (name: string, fallback: string) => style.getPropertyValue(name).trim() || fallback;
    return {
      healthy: read('--color-ink-muted', '#3d4a46'),
      modelled: read('--color-copper', '#9a410d'),
      window: read('--color-brand', '#0e4b4f'),
      limit: read('--color-fail', '#b0231c'),
      grid: read('--color-line', '#d6d0c2'),
      ink: read('--color-ink', '#13201d'),
    };
  }, []);
}

const axisTick = { fontSize: 14 };

/**
 * The modelled and healthy I-V and P-V curves of one string against its inverter input: the MPPT
 * window as a band, the maximum DC voltage, the string's share of the input current and the
 * constant-power limit between MPPT minimum and maximum. Decorative for assistive technology: the
 * panel around it gives the same facts as text and as a table.
 */
export function IvChart({
  healthy,
  modelled,
  healthyMpp,
  modelledMpp,
  window,
}: {
  healthy: readonly IvPoint[];
  modelled: readonly IvPoint[];
  healthyMpp: Mpp;
  modelledMpp: Mpp;
  window: StringWindow;
}) {
  const colours = useThemeColours();
  const vocV = healthy[healthy.length - 1]?.voltageV ?? 0;
  const xMax = Math.ceil((Math.max(vocV, window.maxDcV) * 1.04) / 50) * 50;
  const iscA = healthy[0]?.currentA ?? 0;
  const yMaxA = Math.ceil(Math.max(iscA, window.maxCurrentA) * 1.1);
  const yMaxW = Math.ceil((Math.max(healthyMpp.pmpW, window.maxPowerW) * 1.1) / 500) * 500;

  const power = (curve: readonly IvPoint[]) => curve.map((p) => ({ voltageV: p.voltageV, powerW: p.voltageV * p.currentA }));
  const limit = powerLimitCurve(window);
  const healthyP = power(healthy);
  const modelledP = power(modelled);

  const xAxis = (
    <XAxis
      type="number"
      dataKey="voltageV"
      domain={[0, xMax]}
      tick={axisTick}
      tickFormatter={(v: number) => formatNumber(v)}
      label={{ value: 'Voltage (V)', position: 'insideBottom', offset: -4, fontSize: 14, fill: colours.ink }}
      allowDuplicatedCategory={false}
    />
  );
  const windowBand = (
    <ReferenceArea
      x1={window.mpptMinV}
      x2={window.mpptMaxV}
      fill={colours.window}
      fillOpacity={0.08}
      stroke={colours.window}
      strokeOpacity={0.4}
      label={{ value: 'MPPT window', position: 'insideTop', fontSize: 13, fill: colours.window }}
    />
  );
  const maxDc = (
    <ReferenceLine
      x={window.maxDcV}
      stroke={colours.limit}
      strokeWidth={2}
      label={{ value: `Max DC ${formatNumber(window.maxDcV)} V`, position: 'insideTopRight', fontSize: 13, fill: colours.limit, angle: -90, dx: -12, dy: 60 }}
    />
  );
  const tooltip = (unit: 'A' | 'W') => (
    <Tooltip
      formatter={(value) => `${formatNumber(Number(value), unit === 'A' ? 2 : 0)} ${unit}`}
      labelFormatter={(label) => `${formatNumber(Number(label), 1)} V`}
      contentStyle={{ borderRadius: 8, borderColor: colours.grid }}
    />
  );

  return (
    // Hidden from assistive technology (the figures are given in words beside it), so the charts
    // have Recharts' keyboard layer off: nothing in here may take focus.
    <div aria-hidden="true" className="flex flex-col gap-6">
      <div>
        <p className="mb-1 text-sm font-semibold text-ink-muted">Current against voltage (I-V)</p>
        <ResponsiveContainer width="100%" height={280}>
          <LineChart accessibilityLayer={false} margin={{ top: 16, right: 16, bottom: 16, left: 0 }}>
            <CartesianGrid stroke={colours.grid} strokeDasharray="3 3" />
            {xAxis}
            <YAxis type="number" domain={[0, yMaxA]} tick={axisTick} width={48} label={{ value: 'A', position: 'insideTopLeft', offset: 0, fontSize: 14, fill: colours.ink }} />
            {windowBand}
            {maxDc}
            <ReferenceLine
              y={window.maxCurrentA}
              stroke={colours.limit}
              strokeDasharray="6 3"
              label={{ value: `Input current share ${formatNumber(window.maxCurrentA, 1)} A`, position: 'insideTopLeft', fontSize: 13, fill: colours.limit }}
            />
            <Line data={limit} dataKey="currentA" name="Power limit" stroke={colours.limit} strokeDasharray="2 4" strokeWidth={2} dot={false} isAnimationActive={false} />
            <Line data={[...healthy]} dataKey="currentA" name="Healthy string" stroke={colours.healthy} strokeWidth={2} strokeDasharray="8 4" dot={false} isAnimationActive={false} />
            <Line data={[...modelled]} dataKey="currentA" name="What-if" stroke={colours.modelled} strokeWidth={3} dot={false} isAnimationActive={false} />
            <ReferenceDot x={modelledMpp.vmpV} y={modelledMpp.impA} r={6} fill={colours.modelled} stroke="#fff" strokeWidth={2} />
            <ReferenceDot x={healthyMpp.vmpV} y={healthyMpp.impA} r={5} fill={colours.healthy} stroke="#fff" strokeWidth={2} />
            {tooltip('A')}
            <Legend verticalAlign="top" height={32} wrapperStyle={{ fontSize: 14 }} />
          </LineChart>
        </ResponsiveContainer>
      </div>
      <div>
        <p className="mb-1 text-sm font-semibold text-ink-muted">Power against voltage (P-V)</p>
        <ResponsiveContainer width="100%" height={260}>
          <LineChart accessibilityLayer={false} margin={{ top: 16, right: 16, bottom: 16, left: 0 }}>
            <CartesianGrid stroke={colours.grid} strokeDasharray="3 3" />
            {xAxis}
            <YAxis
              type="number"
              domain={[0, yMaxW]}
              tick={axisTick}
              width={48}
              tickFormatter={(w: number) => formatNumber(w / 1000, 0)}
              label={{ value: 'kW', position: 'insideTopLeft', offset: 0, fontSize: 14, fill: colours.ink }}
            />
            {windowBand}
            {maxDc}
            <Line data={limit} dataKey="powerW" name="Power limit" stroke={colours.limit} strokeDasharray="2 4" strokeWidth={2} dot={false} isAnimationActive={false} />
            <Line data={healthyP} dataKey="powerW" name="Healthy string" stroke={colours.healthy} strokeWidth={2} strokeDasharray="8 4" dot={false} isAnimationActive={false} />
            <Line data={modelledP} dataKey="powerW" name="What-if" stroke={colours.modelled} strokeWidth={3} dot={false} isAnimationActive={false} />
            <ReferenceDot x={modelledMpp.vmpV} y={modelledMpp.pmpW} r={6} fill={colours.modelled} stroke="#fff" strokeWidth={2} />
            <ReferenceDot x={healthyMpp.vmpV} y={healthyMpp.pmpW} r={5} fill={colours.healthy} stroke="#fff" strokeWidth={2} />
            {tooltip('W')}
          </LineChart>
        </ResponsiveContainer>
      </div>
    </div>
  );
}
