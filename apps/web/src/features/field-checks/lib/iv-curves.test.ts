import { describe, expect, it } from 'vitest';
import { downsample, healthyCurveAt, powerRatioPct } from './iv-curves';
import { buildStringSpec } from './test-factories';

describe('downsample', () => {
  const curve = Array.from({ length: 1001 }, (_, k) => ({ voltageV: k, currentA: 10 - k / 100 }));

  it('keeps short curves whole', () => {
    expect(downsample(curve.slice(0, 50), 300)).toHaveLength(50);
  });

  it('keeps the first and last points (Isc and Voc) of a long trace', () => {
    const out = downsample(curve, 300);
    expect(out).toHaveLength(300);
    expect(out[0]).toEqual(curve[0]);
    expect(out.at(-1)).toEqual(curve.at(-1));
  });
});

describe('healthyCurveAt', () => {
  it('models the healthy 25-module string at 800 W/m² and 45 °C near its expected Voc of 1167 V', () => {
    const healthy = healthyCurveAt(buildStringSpec(), 800, 45);
    expect(healthy?.curve.at(-1)?.voltageV).toBeGreaterThan(1150);
    expect(healthy?.curve.at(-1)?.voltageV).toBeLessThan(1185);
    expect(healthy?.pmpW).toBeGreaterThan(7000);
  });

  it('gives no model without sun', () => {
    expect(healthyCurveAt(buildStringSpec(), 0, 45)).toBeNull();
  });
});

describe('powerRatioPct', () => {
  it('compares measured with modelled power', () => {
    expect(powerRatioPct(6800, 8000)).toBeCloseTo(85, 6);
    expect(powerRatioPct(6800, null)).toBeNull();
  });
});
