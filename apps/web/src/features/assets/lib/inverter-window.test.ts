import { describe, expect, it } from 'vitest';
import { judgeMpp, powerLimitCurve, sampleCurve, stringWindow } from './inverter-window';

// The OSR demo inverter: SDI-125K-6, 6 MPPT inputs, 4 strings in parallel per input.
const sdi125 = { maxDcV: 1500, mpptMinV: 600, mpptMaxV: 1300, startV: 600, mpptInputs: 6, maxInputA: 40, maxDcW: 250_000 };

describe('stringWindow', () => {
  it('splits the input current and P = maxDcW / mpptInputs over the strings in parallel', () => {
    const w = stringWindow(sdi125, 4);
    expect(w.maxCurrentA).toBe(10);
    expect(w.maxPowerW).toBeCloseTo(250_000 / 6 / 4, 6);
    expect([w.mpptMinV, w.mpptMaxV, w.maxDcV]).toEqual([600, 1300, 1500]);
  });

  it('treats a missing or zero parallel count as one string on the input', () => {
    expect(stringWindow(sdi125, 0).maxCurrentA).toBe(40);
  });
});

describe('judgeMpp', () => {
  const w = stringWindow(sdi125, 4);

  it('keeps a healthy 26-module MPP at 1 012 V, 9.6 A inside the window', () => {
    const v = judgeMpp({ vmpV: 1012, impA: 9.6, pmpW: 9715, vocV: 1290 }, w);
    expect(v).toEqual({ position: 'inside', isInsideWindow: true, isOverCurrent: false, isOverPower: false, isVocOverMaxDc: false });
  });

  it('reports an MPP dragged under the 600 V MPPT minimum by bypassed substrings', () => {
    const v = judgeMpp({ vmpV: 540, impA: 9.7, pmpW: 5238, vocV: 1200 }, w);
    expect(v.position).toBe('below-mppt-min');
    expect(v.isInsideWindow).toBe(false);
  });

  it('flags clipping when a 28-module string makes 11.3 kW against a 10.4 kW share', () => {
    const v = judgeMpp({ vmpV: 1167.6, impA: 9.71, pmpW: 11_338, vocV: 1394 }, w);
    expect(v.position).toBe('inside');
    expect(v.isOverPower).toBe(true);
    expect(v.isInsideWindow).toBe(false);
  });

  it('flags an open-circuit voltage above the 1 500 V maximum DC voltage', () => {
    expect(judgeMpp({ vmpV: 1300, impA: 9, pmpW: 9000, vocV: 1605 }, w).isVocOverMaxDc).toBe(true);
  });
});

describe('powerLimitCurve', () => {
  it('runs from MPPT min to max, capped by the current share, with constant power above the knee', () => {
    const curve = powerLimitCurve(stringWindow(sdi125, 4), 10);
    expect(curve).toHaveLength(11);
    expect(curve[0]?.voltageV).toBe(600);
    expect(curve[10]?.voltageV).toBe(1300);
    // 10 417 W / 600 V = 17.4 A, above the 10 A share: the current limit rules there.
    expect(curve[0]?.currentA).toBe(10);
    expect(curve[10]?.powerW).toBeCloseTo(250_000 / 24, 6);
  });

  it('draws nothing for an inverted window', () => {
    expect(powerLimitCurve({ ...stringWindow(sdi125, 1), mpptMinV: 900, mpptMaxV: 800 })).toEqual([]);
  });
});

describe('sampleCurve', () => {
  it('keeps the first and last point and spaces the rest evenly', () => {
    const curve = Array.from({ length: 101 }, (_, k) => k);
    expect(sampleCurve(curve, 5)).toEqual([0, 25, 50, 75, 100]);
  });

  it('returns a short curve as it is', () => {
    expect(sampleCurve([1, 2, 3], 10)).toEqual([1, 2, 3]);
  });
});
