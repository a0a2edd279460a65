import { describe, expect, it } from 'vitest';
import { currentAt, curveTable } from './curve';

// A coarse string curve: Isc 10 A, knee near 800 V, Voc 1000 V.
const curve = [
  { voltageV: 0, currentA: 10 },
  { voltageV: 800, currentA: 9 },
  { voltageV: 1000, currentA: 0 },
];

describe('currentAt', () => {
  it('reads between two points on a straight line', () => {
    expect(currentAt(curve, 400)).toBeCloseTo(9.5, 9);
    expect(currentAt(curve, 900)).toBeCloseTo(4.5, 9);
  });

  it('gives Isc at 0 V and nothing beyond Voc', () => {
    expect(currentAt(curve, 0)).toBe(10);
    expect(currentAt(curve, 1200)).toBe(0);
  });

  it('gives 0 A for an empty curve', () => {
    expect(currentAt([], 10)).toBe(0);
  });
});

describe('curveTable', () => {
  it('reads both curves at the same voltages up to the healthy Voc', () => {
    const shaded = [
      { voltageV: 0, currentA: 10 },
      { voltageV: 500, currentA: 5 },
      { voltageV: 950, currentA: 0 },
    ];
    const rows = curveTable(curve, shaded, 3);
    expect(rows.map((r) => r.voltageV)).toEqual([0, 500, 1000]);
    expect(rows[1]).toEqual({ voltageV: 500, healthyA: expect.closeTo(9.375, 9), modelledA: 5 });
    expect(rows[2]?.modelledA).toBe(0);
  });
});
