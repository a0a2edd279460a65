import { describe, expect, it } from 'vitest';
import { meanTimeRows, openByStatusRows, totalOpen } from './metrics-data';

describe('metrics for the charts', () => {
  it('lists every open state in workflow order with zeros filled in', () => {
    const rows = openByStatusRows({ openByStatus: [{ status: 'returned', count: 1, averageAgeHours: 72.6 }, { status: 'reported', count: 2, averageAgeHours: 5.1 }] });
    expect(rows.map((r) => [r.label, r.count])).toEqual([
      ['Reported', 2],
      ['Dispatched', 0],
      ['In the field', 0],
      ['Awaiting sign-off', 0],
      ['Returned', 1],
    ]);
  });

  it('labels mean times by site code and fault category in words', () => {
    const [row] = meanTimeRows({
      meanTimes: [{ siteId: 1, siteCode: 'FWM', faultCategory: 'bypass_diode_failure', tickets: 1, toDispatchHours: 0.5, toRepairHours: 6, toSignOffHours: null }],
    });
    expect(row?.label).toBe('FWM · Bypass diode failure');
  });

  it('counts every open ticket', () => {
    expect(totalOpen({ openByStatus: [{ status: 'reported', count: 2, averageAgeHours: 1 }, { status: 'in_field', count: 3, averageAgeHours: 1 }] })).toBe(5);
  });
});
