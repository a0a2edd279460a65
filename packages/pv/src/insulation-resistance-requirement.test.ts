import { describe, expect, it } from 'vitest';
import { insulationResistanceRequirement } from './insulation-resistance-requirement.ts';

describe('insulationResistanceRequirement (IEC 62446 test 6.7)', () => {
  it.each([
    // IEC 62446:2009 table: test voltages confirmed, minima from memory (pv-field-testing §11 item 27)
    { systemV: 100, testV: 250, minMOhm: 0.5 },
    { systemV: 120, testV: 500, minMOhm: 1 },
    { systemV: 500, testV: 500, minMOhm: 1 },
    { systemV: 957.5, testV: 1000, minMOhm: 1 },
    { systemV: 1400, testV: 1000, minMOhm: 1 },
  ])(
    'tests a $systemV V system at $testV V and wants ≥ $minMOhm MΩ (IEC 62446:2009, §11 item 27)',
    ({ systemV, testV, minMOhm }) => {
      const r = insulationResistanceRequirement(systemV);
      expect(r.testVoltageV).toBe(testV);
      expect(r.minResistanceMOhm).toBe(minMOhm);
      expect(r.edition).toBe('IEC 62446:2009');
    },
  );

  it('uses a 1500 V test above 1000 V in the 2016 edition (from memory, §3.1)', () => {
    expect(insulationResistanceRequirement(1400, '2016').testVoltageV).toBe(1500);
  });

  it('says which values are unconfirmed and that the amendment revised them', () => {
    expect(insulationResistanceRequirement(600).note).toMatch(/AMD1:2018/);
  });

  it('throws for a non-positive system voltage (programmer error)', () => {
    expect(() => insulationResistanceRequirement(0)).toThrow(RangeError);
  });
});
