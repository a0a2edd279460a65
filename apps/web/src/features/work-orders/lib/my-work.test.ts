import type { WorkOrderListItem } from '@stringfield/shared';
import { describe, expect, it } from 'vitest';
import { groupMyWork } from './my-work';

function buildTicket(overrides: Partial<WorkOrderListItem> = {}): WorkOrderListItem {
  return {
    id: 1,
    number: 'WO-2025-00001',
    title: 'String reads 0 A',
    status: 'dispatched',
    priority: 'P2',
    faultCategory: 'open_circuit',
    site: { id: 1, code: 'FWM', name: 'Fenwick Moor Solar', timeZone: 'Europe/Berlin' },
    assignee: { id: 3, name: 'Demo Technician' },
    reportedAt: '2025-10-14T06:00:00.000Z',
    dueAt: '2025-10-14T12:00:00.000Z',
    isOverdue: false,
    isDueSoon: false,
    stringCount: 1,
    stringLabels: ['INV01-MPPT1-S1'],
    version: 0,
    ...overrides,
  };
}

describe('groupMyWork', () => {
  const now = Date.parse('2025-10-14T10:00:00Z'); // 12:00 in Berlin

  it('puts overdue first, then due today, then later, and waiting-for-sign-off last', () => {
    const groups = groupMyWork(
      [
        buildTicket({ id: 1, dueAt: '2025-10-16T08:00:00Z' }),
        buildTicket({ id: 2, dueAt: '2025-10-14T09:00:00Z' }),
        buildTicket({ id: 3, dueAt: '2025-10-14T18:00:00Z' }),
        buildTicket({ id: 4, dueAt: '2025-10-14T09:30:00Z', status: 'awaiting_signoff' }),
        buildTicket({ id: 5, dueAt: '2025-10-14T11:00:00Z', status: 'returned' }),
      ],
      now,
      'Europe/Berlin',
    );
    expect(
      [groups.overdue, groups.dueToday, groups.later, groups.waiting].map((g) => g.map((t) => t.id)),
    ).toEqual([[2], [5, 3], [1], [4]]);
  });

  it('counts "today" on the reader\'s calendar: 23:30 in Berlin is still today for a crew in Berlin', () => {
    const groups = groupMyWork([buildTicket({ dueAt: '2025-10-14T21:30:00Z' })], now, 'Europe/Berlin');
    expect(groups.dueToday).toHaveLength(1);
    expect(
      groupMyWork([buildTicket({ dueAt: '2025-10-14T21:30:00Z' })], now, 'Asia/Tokyo').later,
    ).toHaveLength(1);
  });

  it('keeps the groups in deadline order across sites in different zones', () => {
    const groups = groupMyWork(
      [
        buildTicket({ id: 1, dueAt: '2025-10-14T20:00:00Z' }),
        buildTicket({
          id: 2,
          dueAt: '2025-10-14T23:00:00Z',
          site: { id: 2, code: 'OSR', name: 'Ostrander Ridge', timeZone: 'America/Edmonton' },
        }),
      ],
      now,
      'Europe/Berlin',
    );
    expect([...groups.dueToday, ...groups.later].map((t) => t.id)).toEqual([1, 2]);
  });
});
