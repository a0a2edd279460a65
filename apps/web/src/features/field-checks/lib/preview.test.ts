import { describe, expect, it } from 'vitest';
import { previewCheck } from './preview';
import { buildCheckInput, buildInstrument, buildStringSpec } from './test-factories';

const spec = buildStringSpec();

describe('previewCheck', () => {
  it('waits for a Voc before saying anything', () => {
    expect(previewCheck(spec, { ...buildCheckInput(), vocV: undefined })).toBeNull();
    expect(previewCheck(spec, { ...buildCheckInput(), vocV: Number.NaN })).toBeNull();
  });

  it('passes a healthy string at 800 W/m² and 45 °C (expected Voc 1167.1 V)', () => {
    const preview = previewCheck(spec, buildCheckInput({ vocV: 1167.1, iscA: 8.36 }));
    expect(preview?.verdict).toBe('pass');
    expect(preview?.expected?.vocV).toBeCloseTo(1167.06, 1);
    expect(preview?.vocDeviationPct).toBeCloseTo(0, 1);
  });

  it('flags one bypassed substring when Voc is 15.6 V short', () => {
    const preview = previewCheck(spec, buildCheckInput({ vocV: 1151.5, iscA: 8.3 }));
    expect(preview?.verdict).toBe('fail');
    expect(preview?.findings.map((f) => f.code)).toContain('SUBSTRINGS_BYPASSED');
    expect(preview?.vocDeviationPct).toBeCloseTo(-1.33, 1);
  });

  it('stops on a negative Voc: reversed polarity', () => {
    const preview = previewCheck(spec, buildCheckInput({ vocV: -1167.1, polarityCorrect: false }));
    expect(preview?.verdict).toBe('fail');
    expect(preview?.findings.filter((f) => f.code === 'REVERSE_POLARITY')).toHaveLength(1);
  });

  it('fails polarity recorded as wrong even when Voc looks normal, as the server does', () => {
    const preview = previewCheck(spec, buildCheckInput({ vocV: 1167.1, polarityCorrect: false }));
    expect(preview?.findings.map((f) => f.code)).toContain('REVERSE_POLARITY');
  });

  it('fails insulation below 1 MΩ and asks for a 1000 V test on a 1556 V system', () => {
    const preview = previewCheck(spec, buildCheckInput({ vocV: 1167.1, insulationPlusMOhm: 0.4, insulationMinusMOhm: 40, insulationTestVoltageV: 500 }));
    expect(preview?.findings.map((f) => f.code)).toEqual(['INSULATION_LOW', 'INSULATION_TEST_VOLTAGE_LOW']);
  });

  it('flags an instrument past calibration on the day of the reading', () => {
    const instruments = [buildInstrument({ id: 2, calibrationDueOn: '2026-11-30' })];
    const preview = previewCheck(spec, buildCheckInput({ vocV: 1167.1, iscA: 8.36, instrumentIds: [2] }), instruments, '2026-12-01');
    expect(preview?.verdict).toBe('attention');
    expect(preview?.findings[0]?.code).toBe('INSTRUMENT_CALIBRATION_OVERDUE');
  });

  it('says the expected values assume 25 °C without a module temperature', () => {
    const preview = previewCheck(spec, buildCheckInput({ moduleTempC: undefined, moduleTempMethod: undefined }));
    expect(preview?.isTemperatureAssumed).toBe(true);
  });
});
