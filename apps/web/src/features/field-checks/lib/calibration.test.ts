import { describe, expect, it } from 'vitest';
import { calibrationLabel, calibrationStatus, overdueInstruments } from './calibration';
import { buildInstrument } from './test-factories';

describe('calibrationStatus', () => {
  it.each([
    ['2026-11-30', '2026-12-01', 'overdue', 1],
    ['2026-12-01', '2026-12-01', 'due-soon', 0],
    ['2026-12-31', '2026-12-01', 'due-soon', 30],
    ['2027-06-30', '2026-12-01', 'ok', 211],
  ] as const)('due %s, on %s → %s (%i days)', (dueOn, day, kind, days) => {
    expect(calibrationStatus({ calibrationDueOn: dueOn }, day)).toEqual({ kind, days });
  });

  it('words the overdue badge with the date, not colour alone', () => {
    expect(calibrationLabel({ kind: 'overdue', days: 3 }, '2026-11-28')).toBe('Calibration overdue since 2026-11-28');
  });
});

describe('overdueInstruments', () => {
  it('names only the chosen instruments past their due date (due today is still fine)', () => {
    const list = [buildInstrument({ id: 1, calibrationDueOn: '2026-11-30' }), buildInstrument({ id: 2, calibrationDueOn: '2026-12-01' }), buildInstrument({ id: 3, calibrationDueOn: '2026-01-01' })];
    expect(overdueInstruments(list, [1, 2], '2026-12-01').map((i) => i.id)).toEqual([1]);
  });
});
